package dev.nanoplan.desktop;

import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.sim.ParticleSimulator;
import dev.nanoplan.sim.SimulationSettings;
import dev.nanoplan.sim.TimeStepRule;
import java.util.Locale;
import java.util.OptionalDouble;

/**
 * The Simulation tab's fields as settings: parsing and range checks with one-line messages that
 * start with the field's label, and the estimate of a run's work from the core's time-step rule.
 */
final class SimulationFields {

    /** Largest molecules per emitter the field accepts (counts up to 1e9 stay exact in the core). */
    static final long MAX_MOLECULES_PER_EMITTER = 1_000_000_000L;
    /** Field names as the view labels them; validation messages start with them. */
    static final String MOLECULES_FIELD = "molecules per emitter";
    static final String SEED_FIELD = "seed";
    static final String TIME_STEP_FIELD = "time step s";

    private SimulationFields() {
    }

    /**
     * The settings the fields' texts describe.
     *
     * @param timeStepS blank or "auto" = chosen from the geometry
     * @param threads   simulator worker threads, ≥ 1
     * @throws IllegalArgumentException with a one-line message starting with the field's name
     */
    static SimulationSettings parse(String moleculesPerEmitter, String seed, String timeStepS, int threads) {
        long m = parseLong(MOLECULES_FIELD, moleculesPerEmitter);
        if (m < 1 || m > MAX_MOLECULES_PER_EMITTER) {
            throw new IllegalArgumentException(MOLECULES_FIELD + ": must be a whole number from 1 to "
                    + MAX_MOLECULES_PER_EMITTER + ", got " + m);
        }
        long sd = parseLong(SEED_FIELD, seed);
        String dtText = timeStepS == null ? "" : timeStepS.strip();
        OptionalDouble dt = OptionalDouble.empty();
        if (!dtText.isEmpty() && !dtText.equalsIgnoreCase("auto")) {
            double v;
            try {
                v = Double.parseDouble(dtText);
            } catch (NumberFormatException e) {
                throw new IllegalArgumentException(TIME_STEP_FIELD + ": not a number: '" + dtText
                        + "' (leave blank for automatic)");
            }
            if (!(v > 0) || !Double.isFinite(v)) {
                throw new IllegalArgumentException(TIME_STEP_FIELD + ": must be a finite number > 0 (blank = "
                        + "automatic), got " + dtText);
            }
            dt = OptionalDouble.of(v);
        }
        return new SimulationSettings(m, sd, dt, threads);
    }

    private static long parseLong(String field, String text) {
        String t = text == null ? "" : text.strip().replace("_", "");
        if (t.isEmpty()) {
            throw new IllegalArgumentException(field + ": required");
        }
        try {
            return Long.parseLong(t);
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException(field + ": must be a whole number, got '" + text.strip() + "'");
        }
    }

    /** The estimate of a run's work, from the core's time-step rule (cheap: O(emitters × receivers)). */
    record Work(int emitters, double timeStepS, long stepsPerMolecule, int symbolTimes) {

        /** The work of simulating {@code s} with {@code settings}; refuses a time step too small for the core. */
        static Work of(Scenario s, SimulationSettings settings) {
            int emitters = (int) s.nodes().stream().filter(n -> n.role().emits()).count();
            int slots = s.signalling().isiMemorySymbols() + 1;
            double dt;
            long steps;
            try {
                dt = new ParticleSimulator(settings).timeStepS(s);
                steps = (long) TimeStepRule.stepsPerSymbol(s.signalling().symbolTimeS(), dt) * slots;
            } catch (IllegalArgumentException e) {
                // the core names its parameter (timeStepS); the user knows the field by its label
                throw new IllegalArgumentException(TIME_STEP_FIELD + ": too small ("
                        + e.getMessage().replaceFirst("^timeStepS: ", "") + ")");
            }
            if (steps > Integer.MAX_VALUE) {
                throw new IllegalArgumentException(TIME_STEP_FIELD + ": " + Formats.sig(dt) + " s needs " + steps
                        + " steps to cover " + slots + " symbol times; use a larger time step");
            }
            return new Work(emitters, dt, steps, slots);
        }
    }

    /**
     * The work a run of {@code settings} on {@code s} would do (Δt, steps per molecule, emitters,
     * molecules and at most how many molecule-steps), or why there is nothing to simulate.
     *
     * @throws IllegalArgumentException when the time step is too small for the core
     */
    static String estimate(Scenario s, SimulationSettings settings) {
        Work w = Work.of(s, settings);
        if (w.emitters() == 0) {
            return "nothing to simulate: the layout has no transmitter or relay";
        }
        double moleculeSteps = (double) w.stepsPerMolecule() * w.emitters() * settings.moleculesPerEmitter();
        return String.format(Locale.ROOT, "work: Δt %s s, %d steps per molecule (%d symbol times), %d emitter(s) × %d "
                + "molecules, at most %s molecule-steps", Formats.sig(w.timeStepS()), w.stepsPerMolecule(),
                w.symbolTimes(), w.emitters(), settings.moleculesPerEmitter(), Formats.twoDigits(moleculeSteps));
    }
}
