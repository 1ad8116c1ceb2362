package dev.nanoplan.tolerance;

import java.util.List;

/**
 * What a tolerance study found (the {@code tolerance --json} keys of issue 15, docs/architecture.md §4.3).
 *
 * @param samples        samples combined (fewer than asked when {@code partial})
 * @param seed           seed
 * @param sampler        sampler
 * @param thresholds     thresholds rule
 * @param redraws        draws rejected over all samples (overlap or outside the volume)
 * @param partial        true when the run was stopped before every sample finished
 * @param layoutYield    fraction of samples in which every demand meets its targets
 * @param layoutInterval Wilson 95 % interval of it
 * @param links          per link, the nominal plan's order
 * @param demands        per demand, the scenario's order
 * @param weakLinks      indices into {@code links} of links below {@link ToleranceSummary#WEAK_YIELD}
 *                       yield, likeliest failure first
 * @param driversMethod  "sobol_first_order" or "src" (see {@link ToleranceSummary})
 */
public record ToleranceResult(int samples, long seed, Sampler sampler, Thresholds thresholds, long redraws,
        boolean partial, double layoutYield, List<Double> layoutInterval, List<LinkYield> links,
        List<DemandYield> demands, List<Integer> weakLinks, String driversMethod) {

    public ToleranceResult {
        layoutInterval = List.copyOf(layoutInterval);
        links = List.copyOf(links);
        demands = List.copyOf(demands);
        weakLinks = List.copyOf(weakLinks);
    }

    /**
     * One link.
     *
     * @param from             emitter
     * @param to               receiver
     * @param yield            fraction of samples meeting the error target
     * @param yieldInterval    its Wilson 95 % interval [lo, hi]
     * @param capacityP5Bits   5th percentile of the operating mutual information, bits per symbol
     * @param capacityP50Bits  median
     * @param capacityP95Bits  95th percentile
     * @param drivers          tolerances that drive the error, largest index first
     * @param guardBandMoleculesPerSymbol the emitter's release per symbol at which the link reaches
     *                         {@link ToleranceSummary#WEAK_YIELD} yield; null unless weak (or not reached)
     * @param bits             every sample's mutual information (for histograms)
     */
    public record LinkYield(String from, String to, double yield, List<Double> yieldInterval, double capacityP5Bits,
            double capacityP50Bits, double capacityP95Bits, List<Driver> drivers, Long guardBandMoleculesPerSymbol,
            List<Double> bits) {
        public LinkYield {
            yieldInterval = List.copyOf(yieldInterval);
            drivers = List.copyOf(drivers);
            bits = List.copyOf(bits);
        }

        /** This link with its guard band. */
        public LinkYield withGuardBand(Long molecules) {
            return new LinkYield(from, to, yield, yieldInterval, capacityP5Bits, capacityP50Bits, capacityP95Bits,
                    drivers, molecules, bits);
        }
    }

    /** A tolerance and its share of the variance of the link's log10 error. */
    public record Driver(String tolerance, double index) {
    }

    /** One demand: yield and Wilson 95 % interval. */
    public record DemandYield(String from, String to, double yield, List<Double> yieldInterval) {
        public DemandYield {
            yieldInterval = List.copyOf(yieldInterval);
        }
    }
}
