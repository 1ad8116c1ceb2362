package dev.nanoplan.cli;

import dev.nanoplan.desktop.DesktopLauncher;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import javafx.application.Platform;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code nanoplan ui [FILE] [--snapshot OUT.png]}: the desktop planner, or one rendered snapshot of it. */
@Command(name = "ui", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Opens the desktop planner (JavaFX) on a scenario, or with --snapshot renders the main",
            "window with the plan computed to a PNG file and exits. Needs a display (or xvfb-run)."})
public final class UiCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", arity = "0..1", paramLabel = "FILE", description = "Scenario file to open.")
    Path file;

    @Option(names = "--snapshot", paramLabel = "OUT.png", description = "Render to this PNG and exit (needs FILE).")
    Path snapshot;

    @Option(names = "--width", defaultValue = "1400", description = "Snapshot width in pixels, default ${DEFAULT-VALUE}.")
    int width;

    @Option(names = "--height", defaultValue = "860", description = "Snapshot height in pixels, default ${DEFAULT-VALUE}.")
    int height;

    /** The side panels of the desktop window, in its order (the titles {@code --tab} accepts, any case). */
    static final List<String> TABS = List.of("Links", "Routes", "Budgets", "Compare", "Link charts", "Simulation",
            "Warnings", "Settings");

    @Option(names = "--tab", paramLabel = "PANEL",
            description = "Snapshot with this side panel shown: Links, Routes, Budgets, Compare, \"Link charts\", "
                    + "Simulation, Warnings or Settings.")
    String tab;

    /** Environment (a field so tests can replace it). */
    Map<String, String> environment = System.getenv();

    /**
     * On Linux and other X11/Wayland systems, refuses early (one line, exit 2) when no display is set,
     * instead of letting the toolkit fail with an internal error; Monocle (headless) runs are let through.
     */
    private void requireDisplay() {
        String os = System.getProperty("os.name", "").toLowerCase(Locale.ROOT);
        if (os.contains("win") || os.contains("mac") || "Monocle".equalsIgnoreCase(System.getProperty("glass.platform"))) {
            return;
        }
        if (blank(environment.get("DISPLAY")) && blank(environment.get("WAYLAND_DISPLAY"))) {
            throw new BadInputException("ui: " + noDisplay());
        }
    }

    private static String noDisplay() {
        return "no display to open a window on (DISPLAY is not set); run it in a desktop session, or headless as "
                + "xvfb-run -a ./nanoplan ui ...";
    }

    private static boolean blank(String s) {
        return s == null || s.isBlank();
    }

    @Override
    public Integer call() throws Exception {
        if (file != null && !Files.isRegularFile(file)) {
            throw new BadInputException("FILE: no such file: " + file);
        }
        if (tab != null && TABS.stream().noneMatch(t -> t.equalsIgnoreCase(tab))) {
            throw new BadInputException("--tab: no panel '" + tab + "'; one of: " + String.join(", ", TABS));
        }
        if (snapshot == null) {
            requireDisplay();
            try {
                DesktopLauncher.launch(file);
            } catch (UnsupportedOperationException e) {
                throw new BadInputException("ui: " + noDisplay());
            }
            return 0;
        }
        if (file == null) {
            throw new BadInputException("--snapshot: needs a scenario FILE");
        }
        if (!snapshot.getFileName().toString().toLowerCase(Locale.ROOT).endsWith(".png")) {
            throw new BadInputException("--snapshot: file name must end in .png, got " + snapshot);
        }
        if (width < 200 || width > 8000 || height < 150 || height > 8000) {
            throw new BadInputException("--width/--height: must be 200..8000 × 150..8000 pixels, got " + width + " × "
                    + height);
        }
        OutputPaths.file("--snapshot", snapshot);
        requireDisplay();
        try {
            DesktopLauncher.SnapshotResult r = DesktopLauncher.snapshot(file, snapshot, width, height, tab);
            PrintWriter err = spec.commandLine().getErr();
            err.println("snapshot written to " + snapshot + " (" + r.nodes() + " nodes, " + r.links() + " links)");
            err.flush();
            return 0;
        } finally {
            Platform.exit();
        }
    }
}
