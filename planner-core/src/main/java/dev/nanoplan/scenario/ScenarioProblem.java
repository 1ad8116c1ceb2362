package dev.nanoplan.scenario;

/**
 * One thing wrong (or, in lenient mode, suspicious) in a scenario.
 *
 * <p>{@link #toString()} gives the line shown to users, e.g.
 * {@code nodes[3].radius_um: must be > 0, got -2 (line 14, column 20)}.
 *
 * @param path field path such as {@code nodes[3].radius_um}; empty for the whole document
 * @param message what is wrong, without the path
 * @param line 1-based line of the offending value in the file, or -1 if unknown
 * @param column 1-based column of the offending value, or -1 if unknown
 */
public record ScenarioProblem(String path, String message, int line, int column) {

    /** @throws IllegalArgumentException if path or message is null */
    public ScenarioProblem {
        Checks.required("path", path);
        Checks.required("message", message);
        if (line < 1 || column < 1) {
            line = -1;
            column = -1;
        }
    }

    /** A problem without a file position (e.g. found in a scenario built in code). */
    public static ScenarioProblem at(String path, String message) {
        return new ScenarioProblem(path, message, -1, -1);
    }

    /** Whether the file position is known. */
    public boolean hasLocation() {
        return line > 0;
    }

    /** This problem at another file position. */
    ScenarioProblem locatedAt(int newLine, int newColumn) {
        return new ScenarioProblem(path, message, newLine, newColumn);
    }

    @Override
    public String toString() {
        String where = hasLocation() ? " (line " + line + ", column " + column + ")" : "";
        return (path.isEmpty() ? "" : path + ": ") + message + where;
    }
}
