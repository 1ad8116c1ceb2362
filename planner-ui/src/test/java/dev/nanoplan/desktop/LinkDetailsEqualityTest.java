package dev.nanoplan.desktop;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import java.util.function.Supplier;
import org.junit.jupiter.api.Test;

/**
 * A record's generated equals compares arrays (and lists of arrays) by identity; {@link LinkDetails}
 * compares every component by content. Checked by hand-made instances: equal content in distinct
 * arrays is equal, a change in any single component (or a single point) is not.
 */
class LinkDetailsEqualityTest {

    private static LinkDetails details(double tap, double countMass, long threshold, double miBits, double log10Error,
            double target) {
        return new LinkDetails(RouteSummaryTest.link("tx", "rx", 0.9), new double[] {0.1, tap},
                List.of(List.of(new double[] {0, 0.9}, new double[] {1, 0.1}),
                        List.of(new double[] {0, 0.2}, new double[] {1, countMass})),
                threshold, List.of(new double[] {1, miBits}), List.of(new double[] {100, log10Error}), target);
    }

    @Test
    void equalContentIsEqualAndAnySingleChangeIsNot() {
        Supplier<LinkDetails> base = () -> details(0.05, 0.8, 1, 0.5, -3, -2);
        LinkDetails a = base.get();
        LinkDetails b = base.get();
        assertThat(b.taps()).isNotSameAs(a.taps());
        assertThat(b).isEqualTo(a).hasSameHashCodeAs(a);
        List<LinkDetails> changed = List.of(
                new LinkDetails(RouteSummaryTest.link("tx", "rx", 0.8), a.taps(), a.countCurves(), 1,
                        a.miByThreshold(), a.errorByMolecules(), -2),
                details(0.06, 0.8, 1, 0.5, -3, -2),
                details(0.05, 0.7, 1, 0.5, -3, -2),
                details(0.05, 0.8, 2, 0.5, -3, -2),
                details(0.05, 0.8, 1, 0.4, -3, -2),
                details(0.05, 0.8, 1, 0.5, -4, -2),
                details(0.05, 0.8, 1, 0.5, -3, -3));
        for (LinkDetails c : changed) {
            assertThat(c).as("changed in one component").isNotEqualTo(a);
        }
    }
}
