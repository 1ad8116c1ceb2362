package dev.nanoplan.report;

import java.util.List;

/** The cautions of docs/architecture.md §6, in the words every output uses. */
public final class Cautions {

    /** One line for machine-readable outputs. */
    public static final String SHORT = "Model estimates only: not validated for clinical use; in-vivo or clinical "
            + "deployment follows local regulations, ethics approval and licensed practice; wet-lab work follows "
            + "local biosafety rules.";

    /** The assumptions every closed-form result rests on. */
    public static final List<String> ASSUMPTIONS = List.of(
            "Molecules move and are counted independently of each other.",
            "Symbols (own and neighbours') are independent and identically distributed with the prior.",
            "Receivers are perfect absorbers of their own species and transparent to others.",
            "Open, still medium: no walls, no flow, no shading by other receivers, unless the channel was simulated.",
            "All emitters share one synchronous symbol clock.");

    /** The full caution paragraph. */
    public static final List<String> FULL = List.of(
            "nanoplan's plans are estimates from physical and statistical models, not measurements.",
            "Results are not validated for clinical use. Any in-vivo or clinical deployment must follow local "
                    + "regulations, ethics approval and licensed medical practice.",
            "Wet-lab work with engineered cells or synthetic molecules follows your local biosafety rules.");

    private Cautions() {
    }
}
