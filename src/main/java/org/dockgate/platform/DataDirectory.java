package org.dockgate.platform;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.stereotype.Component;

/**
 * The data directory ({@code dockgate.data-dir}, default {@code ./data}): the H2 database file, key
 * stores, audit seals. Resolved once, so every module sees the same folder.
 */
@Component
public class DataDirectory {

    private final Path root;

    DataDirectory(@Value("${dockgate.data-dir:./data}") String dataDir) {
        this.root = Path.of(dataDir).toAbsolutePath().normalize();
    }

    public Path root() {
        return root;
    }

    /** A sub-folder, created when missing. */
    public Path folder(String name) {
        Path folder = root.resolve(name);
        try {
            Files.createDirectories(folder);
        } catch (IOException e) {
            throw new UncheckedIOException("Cannot create the folder " + folder, e);
        }
        return folder;
    }
}
