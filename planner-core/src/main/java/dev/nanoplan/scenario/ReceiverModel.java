package dev.nanoplan.scenario;

import java.util.Locale;

/**
 * How a receiver (or relay) counts the molecules of its species (scenario field {@code receiver}):
 * <ul>
 *   <li>{@code absorbing} (default): a perfect absorber that counts every molecule reaching its surface
 *       in the slot (M. von Smoluchowski's absorbing sphere);</li>
 *   <li>{@code reactive}: a receptor-covered sphere that binds a molecule at its surface with the finite
 *       rate {@code bindingRateUmPerS} κ (the reactive boundary condition of F. C. Collins and G. E.
 *       Kimball, J. Colloid Sci. 4, 1949); it counts and removes the bound molecules;</li>
 *   <li>{@code passive}: a transparent observer that counts the molecules inside it at one instant per
 *       slot, {@code samplingOffsetS} after the slot starts ({@code null}: the end of the slot); it
 *       removes nothing.</li>
 * </ul>
 *
 * @param kind              the model
 * @param bindingRateUmPerS κ in µm/s, finite and &gt; 0 for {@code reactive}, {@code null} otherwise
 * @param samplingOffsetS   the sampling instant after each slot starts in s, finite and &gt; 0, for
 *                          {@code passive} only; {@code null} for the end of the slot (and for other kinds)
 */
public record ReceiverModel(Kind kind, Double bindingRateUmPerS, Double samplingOffsetS) {

    /** The three models, with their file names. */
    public enum Kind {
        ABSORBING, PASSIVE, REACTIVE;

        /** The file name, e.g. {@code "passive"}. */
        public String id() {
            return name().toLowerCase(Locale.ROOT);
        }

        /**
         * @param text a file name
         * @return the kind
         * @throws IllegalArgumentException for an unknown name
         */
        public static Kind parse(String text) {
            for (Kind k : values()) {
                if (k.id().equals(text)) {
                    return k;
                }
            }
            throw new IllegalArgumentException("unknown receiver '" + text + "', expected " + EXPECTED);
        }
    }

    /** The accepted file names, for messages. */
    public static final String EXPECTED = "absorbing, passive or reactive";

    /** The default perfect absorber. */
    public static final ReceiverModel ABSORBING = new ReceiverModel(Kind.ABSORBING, null, null);

    /** @throws IllegalArgumentException naming the bad parameter */
    public ReceiverModel {
        Checks.required("kind", kind);
        if (kind == Kind.REACTIVE) {
            if (bindingRateUmPerS == null || !(bindingRateUmPerS > 0 && bindingRateUmPerS < Double.POSITIVE_INFINITY)) {
                throw new IllegalArgumentException("bindingRateUmPerS: must be finite and > 0 for a reactive receiver, got "
                        + bindingRateUmPerS);
            }
        } else if (bindingRateUmPerS != null) {
            throw new IllegalArgumentException("bindingRateUmPerS: only for a reactive receiver, this one is " + kind.id());
        }
        if (samplingOffsetS != null) {
            if (kind != Kind.PASSIVE) {
                throw new IllegalArgumentException("samplingOffsetS: only for a passive receiver, this one is " + kind.id());
            }
            if (!(samplingOffsetS > 0 && samplingOffsetS < Double.POSITIVE_INFINITY)) {
                throw new IllegalArgumentException("samplingOffsetS: must be finite and > 0, got " + samplingOffsetS);
            }
        }
    }

    /** A passive observer sampling {@code samplingOffsetS} after each slot starts ({@code null}: slot end). */
    public static ReceiverModel passive(Double samplingOffsetS) {
        return new ReceiverModel(Kind.PASSIVE, null, samplingOffsetS);
    }

    /** A reactive (Collins–Kimball) sphere with binding rate κ in µm/s. */
    public static ReceiverModel reactive(double bindingRateUmPerS) {
        return new ReceiverModel(Kind.REACTIVE, bindingRateUmPerS, null);
    }

    /** Whether the receiver takes the molecules it counts out of the medium (false only for passive). */
    public boolean absorbs() {
        return kind != Kind.PASSIVE;
    }

    /** Whether this is the default perfect absorber. */
    public boolean isAbsorbing() {
        return kind == Kind.ABSORBING;
    }
}
