package dev.nanoplan.cli;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;

/**
 * Checks of the places a command will write to, made before any work or printing so that a run never
 * computes for minutes and then fails on a folder: one line naming the option and the path (exit 2).
 * Missing parent folders are never created silently.
 */
final class OutputPaths {

    private OutputPaths() {
    }

    /**
     * An output folder ({@code --out DIR}): it must be a writable folder, or be missing with a writable
     * parent folder, in which case it is created now (only that one level).
     *
     * @throws BadInputException naming {@code option} and the path otherwise
     */
    static void folder(String option, Path dir) {
        Path abs = dir.toAbsolutePath();
        if (Files.exists(abs) && !Files.isDirectory(abs)) {
            throw new BadInputException(option + ": not a folder: " + dir);
        }
        if (!Files.exists(abs)) {
            Path parent = abs.getParent();
            if (parent == null || !Files.isDirectory(parent)) {
                throw new BadInputException(option + ": folder " + (parent == null ? dir : parent)
                        + " does not exist (create it first)");
            }
            probe(option, parent, parent);
            try {
                Files.createDirectory(abs);
            } catch (IOException e) {
                throw new BadInputException(option + ": cannot create folder " + dir + " (" + why(e) + ")");
            }
        }
        probe(option, abs, dir);
    }

    /**
     * An output file ({@code --plot FILE}): its folder must exist and be writable, and the file itself
     * must not be a folder.
     *
     * @throws BadInputException naming {@code option} and the path otherwise
     */
    static void file(String option, Path file) {
        Path abs = file.toAbsolutePath();
        if (Files.isDirectory(abs)) {
            throw new BadInputException(option + ": is a folder, not a file: " + file);
        }
        Path parent = abs.getParent();
        if (parent == null || !Files.isDirectory(parent)) {
            throw new BadInputException(option + ": folder " + (parent == null ? file : parent)
                    + " does not exist (create it first)");
        }
        probe(option, parent, parent);
    }

    /** Creates and deletes a temporary file in {@code dir}: the one test of writability that also holds for root. */
    private static void probe(String option, Path dir, Path shown) {
        try {
            Path p = Files.createTempFile(dir, ".nanoplan-write-check.", ".tmp");
            Files.delete(p);
        } catch (IOException | SecurityException e) {
            throw new BadInputException(option + ": cannot write into folder " + shown + " (" + why(e) + ")");
        }
    }

    private static String why(Exception e) {
        String s = e.getClass().getSimpleName().replace("Exception", "");
        return switch (s) {
            case "AccessDenied" -> "permission denied";
            case "FileSystem" -> e.getMessage() != null && e.getMessage().contains("Read-only") ? "read-only file system"
                    : "file system error";
            case "NoSuchFile" -> "no such folder";
            default -> e.getMessage() == null ? s : ErrorHandling.oneLine(e.getMessage());
        };
    }
}
