package dev.nanoplan.plan;

/** TEMP placeholder (drop at merge): planner settings. */
public record PlanOptions(double capacityFloorBits) {

    /** TEMP default. */
    public static final PlanOptions DEFAULT = new PlanOptions(1e-3);

    /** TEMP: the same settings with another capacity floor. */
    public PlanOptions withFloor(double floorBits) {
        return new PlanOptions(floorBits);
    }
}
