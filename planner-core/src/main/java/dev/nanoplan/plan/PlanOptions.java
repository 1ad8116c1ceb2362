package dev.nanoplan.plan;

/** TEMP placeholder for the desktop branch (drop at merge; the planner branch owns this file). */
public record PlanOptions(double capacityFloorBits) {

    /** TEMP default. */
    public static final PlanOptions DEFAULT = new PlanOptions(0.01);
}
