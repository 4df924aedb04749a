package org.dockgate.bench;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import tools.jackson.databind.json.JsonMapper;

/** The upload copy of a background import: owner-only, in Dockgate's own folder, leftovers removed at start. */
class ImportJobsTest {

    @TempDir Path dir;

    @Test
    void theCopyIsOwnerOnlyAndLeftoversAreRemovedAtStart() throws Exception {
        Path folder = dir.resolve("tmp");
        Files.createDirectories(folder);
        Path leftover = Files.writeString(folder.resolve(ImportJobs.PREFIX + "crashed.csv"), "serial,...");
        Path unrelated = Files.writeString(folder.resolve("keep.txt"), "not ours");
        ImportJobs jobs = new ImportJobs(null, folder);
        assertThat(leftover).doesNotExist();
        assertThat(unrelated).exists();
        assertThat(PosixFilePermissions.toString(Files.getPosixFilePermissions(folder))).isEqualTo("rwx------");
        Path copy = jobs.copy(new ByteArrayInputStream("serial,test\n".getBytes(StandardCharsets.UTF_8)));
        assertThat(copy.getParent()).isEqualTo(folder);
        assertThat(PosixFilePermissions.toString(Files.getPosixFilePermissions(copy))).isEqualTo("rw-------");
        assertThat(Files.readString(copy)).isEqualTo("serial,test\n");
    }

    @Test
    void theJobsJsonCarriesItsPercent() {
        ImportJobs.Job job = new ImportJobs.Job("j", 1, ImportJobs.State.RUNNING, 10, 25, 100, null, null);
        String json = JsonMapper.builder().build().writeValueAsString(job);
        assertThat(json).contains("\"percent\":25");
    }
}
