package dev.nanoplan.plan;

import java.util.List;

/**
 * The chosen route of one demand (the {@code routes} entries of docs/architecture.md §4.3).
 *
 * @param from                    demand source id
 * @param to                      demand destination id
 * @param hops                    node ids, source first; empty when unreachable
 * <p>Every figure is the operating point (mutual information at the file's input law, the detectors
 * at their operating thresholds), not the capacity; the names are kept from the plan JSON contract.
 *
 * @param bottleneckCapacityBits  operating mutual information of the weakest hop (0 when unreachable)
 * @param bottleneckFrom          weakest hop's emitter (null when unreachable)
 * @param bottleneckTo            weakest hop's receiver (null when unreachable)
 * @param endToEndCapacityBits    mutual information of the symbol-forwarding cascade at the file's
 *                                input law (≤ bottleneck)
 * @param rateBitsPerS            end-to-end information / (frame · symbol time)
 * @param latencyS                hops × symbol time
 * @param directCapacityBits      operating mutual information of the direct link, or null when none
 * @param bottleneckLimitedBy     why the weakest hop is weak (null when unreachable)
 * @param advice                  what would fix it, in words a device engineer acts on
 */
public record RouteReport(String from, String to, List<String> hops, double bottleneckCapacityBits,
        String bottleneckFrom, String bottleneckTo, double endToEndCapacityBits, double rateBitsPerS,
        double latencyS, Double directCapacityBits, Impairment bottleneckLimitedBy, String advice) {

    public RouteReport {
        hops = List.copyOf(hops);
    }

    /** True when a route exists. */
    public boolean reachable() {
        return !hops.isEmpty();
    }
}
