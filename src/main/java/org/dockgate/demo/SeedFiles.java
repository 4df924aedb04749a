package org.dockgate.demo;

import java.io.IOException;
import java.io.Reader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;

/** Reads the demo scenario's plain files. */
final class SeedFiles {

    private final Path folder;

    SeedFiles(Path folder) {
        this.folder = folder;
    }

    Path folder() {
        return folder;
    }

    Path file(String name) {
        return folder.resolve(name);
    }

    boolean exists(String name) {
        return Files.isRegularFile(file(name));
    }

    /** Rows of a CSV file with a header row, as column-name → value maps. */
    List<Map<String, String>> csv(String name) {
        CSVFormat format = CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true).setTrim(true)
                .setIgnoreEmptyLines(true).setCommentMarker('#').get();
        try (Reader reader = Files.newBufferedReader(file(name), StandardCharsets.UTF_8);
             CSVParser parser = CSVParser.parse(reader, format)) {
            List<Map<String, String>> rows = new ArrayList<>();
            for (CSVRecord record : parser) {
                rows.add(record.toMap());
            }
            return rows;
        } catch (IOException e) {
            throw new UncheckedIOException("Cannot read the seed file " + file(name), e);
        }
    }

    String text(String name) {
        try {
            return Files.readString(file(name), StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException("Cannot read the seed file " + file(name), e);
        }
    }
}
