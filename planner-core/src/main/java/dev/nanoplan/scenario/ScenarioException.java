package dev.nanoplan.scenario;

import java.util.List;
import java.util.stream.Collectors;

/**
 * A scenario could not be read or is invalid. Carries every problem found, not only the first;
 * {@link #getMessage()} lists them one per line in the form
 * {@code nodes[3].radius_um: must be > 0, got -2 (line 14, column 20)}.
 */
public final class ScenarioException extends Exception {

    private static final long serialVersionUID = 1L;

    /** The problems, never empty. */
    private final transient List<ScenarioProblem> problems;

    /**
     * @param problems at least one problem
     * @throws IllegalArgumentException if the list is empty
     */
    public ScenarioException(List<ScenarioProblem> problems) {
        super(problems.stream().map(ScenarioProblem::toString).collect(Collectors.joining("\n")));
        if (problems.isEmpty()) {
            throw new IllegalArgumentException("a ScenarioException needs at least one problem");
        }
        this.problems = List.copyOf(problems);
    }

    /** Every problem found, in file order where positions are known. */
    public List<ScenarioProblem> problems() {
        return problems;
    }
}
