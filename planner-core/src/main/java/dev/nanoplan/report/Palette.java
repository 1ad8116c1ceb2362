package dev.nanoplan.report;

import dev.nanoplan.scenario.Role;
import java.util.Locale;

/**
 * The one colour scheme of the desktop and the HTML report, colour-blind safe: node roles and route
 * hops from the eight-colour set of M. Okabe and K. Ito, "Color Universal Design (CUD): how to make
 * figures and presentations that are friendly to colorblind people", 2008; link capacity on the
 * viridis scale (S. van der Walt and N. Smith, matplotlib's default colour map, 2015: perceptually
 * uniform, readable in grey and with the common colour-vision deficiencies), five of its published
 * stops, linear in sRGB between them.
 */
public final class Palette {

    /** Okabe–Ito sky blue: transmitters. */
    public static final String TRANSMITTER = "#56b4e9";
    /** Okabe–Ito orange: receivers. */
    public static final String RECEIVER = "#e69f00";
    /** Okabe–Ito reddish purple: relays. */
    public static final String RELAY = "#cc79a7";
    /** Okabe–Ito vermilion: route hops. */
    public static final String ROUTE = "#d55e00";
    /** Bright pink of the desktop's bottleneck hop (the 3D scene's tube and the legend's swatch). */
    public static final String BOTTLENECK = "#ff5ea8";
    /** Grey for a value that is not known (NaN). */
    public static final String UNKNOWN = "#8a8f98";

    /** Viridis at 0, 0.25, 0.5, 0.75 and 1 (matplotlib's listed colour map). */
    private static final int[][] VIRIDIS = {
        {0x44, 0x01, 0x54}, {0x3b, 0x52, 0x8b}, {0x21, 0x91, 0x8c}, {0x5e, 0xc9, 0x62}, {0xfd, 0xe7, 0x25}};

    private Palette() {
    }

    /** The colour of a node role, {@code #rrggbb}. */
    public static String role(Role role) {
        return switch (role) {
            case TRANSMITTER -> TRANSMITTER;
            case RECEIVER -> RECEIVER;
            case RELAY -> RELAY;
        };
    }

    /**
     * The capacity colour of a fraction of the full scale (bits / log2 levels), {@code #rrggbb}:
     * viridis, dark purple at 0 to yellow at 1; clamped to [0, 1]; NaN gives {@link #UNKNOWN}.
     */
    public static String capacity(double fraction) {
        if (Double.isNaN(fraction)) {
            return UNKNOWN;
        }
        double f = Math.max(0, Math.min(1, fraction)) * (VIRIDIS.length - 1);
        int i = Math.min(VIRIDIS.length - 2, (int) Math.floor(f));
        double w = f - i;
        int[] c = new int[3];
        for (int k = 0; k < 3; k++) {
            c[k] = (int) Math.round(VIRIDIS[i][k] + w * (VIRIDIS[i + 1][k] - VIRIDIS[i][k]));
        }
        return String.format(Locale.ROOT, "#%02x%02x%02x", c[0], c[1], c[2]);
    }
}
