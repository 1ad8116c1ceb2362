package dev.nanoplan.io;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.channels.Channels;
import java.nio.channels.FileChannel;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.nio.file.attribute.PosixFilePermissions;

/**
 * Writes files via a temporary file in the same folder, forced to disk, and a rename, so no
 * half-written file is ever seen and a failed write leaves the old file untouched. The one
 * atomic writer of the project (scenarios, reports, plots, caches, snapshots).
 */
public final class AtomicFiles {

    /** Writes content into a stream. */
    @FunctionalInterface
    public interface Content {
        void writeTo(OutputStream out) throws IOException;
    }

    private AtomicFiles() {
    }

    /** Writes {@code content} to {@code file}, replacing it if present. */
    public static void write(Path file, byte[] content) throws IOException {
        write(file, out -> out.write(content));
    }

    /** Streams {@code content} to {@code file}, replacing it if present. */
    public static void write(Path file, Content content) throws IOException {
        Path abs = file.toAbsolutePath();
        Path dir = abs.getParent();
        if (dir != null) {
            Files.createDirectories(dir);
        }
        Path tmp = Files.createTempFile(dir, "." + abs.getFileName() + ".", ".tmp");
        try {
            try (FileChannel ch = FileChannel.open(tmp, StandardOpenOption.WRITE, StandardOpenOption.TRUNCATE_EXISTING);
                    OutputStream out = Channels.newOutputStream(ch)) {
                content.writeTo(out);
                out.flush();
                ch.force(true);
            }
            try {
                // temporary files are created owner-only; results are ordinary readable files
                Files.setPosixFilePermissions(tmp, PosixFilePermissions.fromString("rw-r--r--"));
            } catch (UnsupportedOperationException notPosix) {
                // keep the platform's default
            }
            try {
                Files.move(tmp, abs, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
            } catch (AtomicMoveNotSupportedException e) {
                Files.move(tmp, abs, StandardCopyOption.REPLACE_EXISTING);
            }
        } finally {
            Files.deleteIfExists(tmp);
        }
    }
}
