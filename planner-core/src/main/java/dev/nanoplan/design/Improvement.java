package dev.nanoplan.design;

import dev.nanoplan.scenario.Scenario;
import java.util.List;

/**
 * What a layout search found.
 *
 * @param before       the input layout
 * @param after        the best layout found (the input when nothing better was found)
 * @param assessedBefore the input's objective and demands
 * @param assessedAfter  the result's (never worse than the input's on the objective)
 * @param changes      from {@code before} to {@code after}, in plain words
 * @param evaluations  layouts re-planned
 * @param seconds      wall-clock time of the search
 * @param stoppedEarly true when the time limit or a cancel ended the search before it converged
 */
public record Improvement(Scenario before, Scenario after, Assessment assessedBefore, Assessment assessedAfter,
        List<Change> changes, int evaluations, double seconds, boolean stoppedEarly) {

    public Improvement {
        changes = List.copyOf(changes);
    }
}
