package dev.nanoplan.physics;

import java.util.stream.Stream;

import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;

/**
 * Seeded random test points: geometry, diffusion, time and decay rate drawn log-uniformly.
 *
 * @param distanceUm d
 * @param radiusUm r
 * @param diffusionUm2PerS D
 * @param timeS t, chosen through x = a/√(4Dt) ∈ [0.05, 20] (F from ~r/d down to ~1e-176)
 * @param halfLifeS chosen through b = a√(λ/D) ∈ [1e-4, 20]
 */
record RandomGeometry(double distanceUm, double radiusUm, double diffusionUm2PerS, double timeS,
                      double halfLifeS) {

    static Stream<RandomGeometry> draw(long seed, int count) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        return Stream.generate(() -> {
            double radius = logUniform(rng, 0.1, 20);
            double distance = radius * (1 + logUniform(rng, 1e-3, 1e2));
            double diffusion = logUniform(rng, 1, 2000);
            double gap = distance - radius;
            double x = logUniform(rng, 0.05, 20);
            double time = gap * gap / (4 * diffusion * x * x);
            double b = logUniform(rng, 1e-4, 20);
            double rate = diffusion * (b / gap) * (b / gap);
            return new RandomGeometry(distance, radius, diffusion, time, Math.log(2) / rate);
        }).limit(count);
    }

    static double logUniform(UniformRandomProvider rng, double lo, double hi) {
        return lo * Math.exp(rng.nextDouble() * Math.log(hi / lo));
    }

    double gapUm() {
        return distanceUm - radiusUm;
    }

    /** c = a²/(4D) in s. */
    double scaleS() {
        return gapUm() * gapUm() / (4 * diffusionUm2PerS);
    }

    double decayRatePerS() {
        return Math.log(2) / halfLifeS;
    }
}
