package dev.nanoplan.desktop;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.InvalidPathException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import javafx.collections.FXCollections;
import javafx.collections.ObservableList;

/**
 * The most recently opened or saved scenario files, newest first, at most {@value #LIMIT}, kept in
 * a small text file (one path per line). A store that cannot be read or written is ignored: the
 * list then lives for the session only.
 */
public final class RecentFiles {

    /** Most files remembered. */
    public static final int LIMIT = 8;

    private final Path store;
    private final ObservableList<Path> files = FXCollections.observableArrayList();

    /** @param store the text file that keeps the list, or null for a list kept in memory only */
    public RecentFiles(Path store) {
        this.store = store;
        if (store != null && Files.isRegularFile(store)) {
            try {
                for (String line : Files.readAllLines(store, StandardCharsets.UTF_8)) {
                    if (!line.isBlank() && files.size() < LIMIT) {
                        try {
                            files.add(Path.of(line.trim()));
                        } catch (InvalidPathException ignored) {
                            // skip a line that is not a path
                        }
                    }
                }
            } catch (IOException ignored) {
                // unreadable store: start empty
            }
        }
    }

    /** The store in {@code ~/.nanoplan/recent-files.txt}. */
    public static RecentFiles inUserHome() {
        return new RecentFiles(Path.of(System.getProperty("user.home"), ".nanoplan", "recent-files.txt"));
    }

    /** Moves {@code file} to the top of the list. */
    public void add(Path file) {
        Path abs = file.toAbsolutePath().normalize();
        files.remove(abs);
        files.add(0, abs);
        if (files.size() > LIMIT) {
            files.remove(LIMIT, files.size());
        }
        persist();
    }

    /** The list, newest first. */
    public ObservableList<Path> files() {
        return files;
    }

    private void persist() {
        if (store == null) {
            return;
        }
        try {
            Files.createDirectories(store.toAbsolutePath().getParent());
            List<String> lines = new ArrayList<>();
            files.forEach(f -> lines.add(f.toString()));
            Files.write(store, lines, StandardCharsets.UTF_8);
        } catch (IOException ignored) {
            // a read-only home keeps the list for this session only
        }
    }
}
