package dev.nanoplan.plan;

/** TEMP placeholder (drop at merge): text summary. */
public final class PlanText {

    private PlanText() {
    }

    /** TEMP. */
    public static String render(Plan plan) {
        return "plan of " + plan.scenario().name() + ": " + plan.links().size() + " links, "
                + plan.routes().size() + " routes\n";
    }
}
