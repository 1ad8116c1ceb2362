package dev.nanoplan.desktop;

import java.util.LinkedHashMap;
import java.util.Map;
import javafx.beans.binding.Bindings;
import javafx.beans.binding.StringBinding;
import javafx.beans.value.ObservableValue;
import javafx.collections.FXCollections;
import javafx.collections.ObservableMap;

/**
 * The validation messages of an editor's fields, keyed by the field's path in the scenario file
 * ({@code signalling.symbol_time_s}, {@code nodes[3].radius_um}), so the view can show each message
 * beside its field. Each message is one line and starts with that path, as the file reader's do.
 *
 * <p>The editors parse every field through {@link #number} and {@link #whole}, which record a
 * malformed value and go on, so all malformed fields are marked at once; the range checks of the
 * core's records come one at a time, turned into file names by {@link #translate}.
 * Threading: the UI thread only.
 */
public final class FieldErrors {

    /**
     * Record component names used in the core's messages and the file's field names. The component
     * names are unique across the records the editors build, so one table serves all of them.
     */
    private static final Map<String, String> FILE_NAMES = Map.ofEntries(
            Map.entry("temperatureK", "temperature_K"),
            Map.entry("viscosityMPaS", "viscosity_mPa_s"),
            Map.entry("backgroundMoleculesPerS", "background_molecules_per_s"),
            Map.entry("meanSpeedUmPerS", "mean_speed_um_per_s"),
            Map.entry("velocityUmPerS", "velocity_um_per_s"),
            Map.entry("symbolTimeS", "symbol_time_s"),
            Map.entry("isiMemorySymbols", "isi_memory_symbols"),
            Map.entry("levels", "levels"),
            Map.entry("priorOne", "prior_one"),
            Map.entry("frameSlots", "frame_slots"),
            Map.entry("name", "name"),
            Map.entry("diffusionUm2PerS", "diffusion_um2_per_s"),
            Map.entry("hydrodynamicRadiusNm", "hydrodynamic_radius_nm"),
            Map.entry("halfLifeS", "half_life_s"),
            Map.entry("id", "id"),
            Map.entry("radiusUm", "radius_um"),
            Map.entry("species", "species"),
            Map.entry("emitsSpecies", "emits_species"),
            Map.entry("moleculesPerSymbol", "molecules_per_symbol"),
            Map.entry("receiver", "receiver"),
            Map.entry("bindingRateUmPerS", "binding_rate_um_per_s"),
            Map.entry("samplingOffsetS", "sampling_offset_s"));

    /** A refused value: the file path of its field and a one-line message starting with that path. */
    public static final class FieldException extends IllegalArgumentException {
        private static final long serialVersionUID = 1L;
        private final String field;

        FieldException(String field, String message) {
            super(message);
            this.field = field;
        }

        /** The field's path in the scenario file, e.g. {@code signalling.symbol_time_s}. */
        public String field() {
            return field;
        }
    }

    private final ObservableMap<String, String> messages = FXCollections.observableMap(new LinkedHashMap<>());

    /** The message shown beside the field at {@code path} ("" when the field is fine). */
    public StringBinding message(String path) {
        return Bindings.createStringBinding(() -> messages.getOrDefault(path, ""), messages);
    }

    /**
     * The first message of a field whose path starts with {@code prefix} ("" when none), for one
     * message under a group of fields (a species row, the three velocity components).
     */
    public StringBinding messageUnder(String prefix) {
        return Bindings.createStringBinding(() -> messages.entrySet().stream()
                .filter(e -> e.getKey().startsWith(prefix)).map(Map.Entry::getValue).findFirst().orElse(""), messages);
    }

    /** The current messages by field path, in the order they were found (read-only). */
    public ObservableMap<String, String> all() {
        return FXCollections.unmodifiableObservableMap(messages);
    }

    /** Forgets the message of {@code key} as soon as {@code field} changes (the user is fixing it). */
    void clearOnEdit(ObservableValue<?> field, String key) {
        field.addListener((o, a, b) -> messages.remove(key));
    }

    /** Forgets every message (the fields were reloaded or applied). */
    public void clear() {
        messages.clear();
    }

    /** Records {@code e} beside its field and returns it, for {@code throw errors.record(e)}. */
    FieldException record(FieldException e) {
        messages.putIfAbsent(e.field(), e.getMessage());
        return e;
    }

    /** Throws the first recorded message, if any. */
    void throwFirst() {
        if (!messages.isEmpty()) {
            Map.Entry<String, String> first = messages.entrySet().iterator().next();
            throw new FieldException(first.getKey(), first.getValue());
        }
    }

    /** The finite number typed in the field at {@code path}; NaN (with the message recorded) when it is not one. */
    double number(String path, String text) {
        return number(path, path, text);
    }

    /** As {@link #number(String, String)}, the message recorded under {@code key} and naming {@code path}. */
    double number(String key, String path, String text) {
        String t = SettingsText.trim(text);
        try {
            double v = Double.parseDouble(t);
            if (Double.isFinite(v)) {
                return v;
            }
            record(new FieldException(key, path + " must be a finite number, got " + t));
        } catch (NumberFormatException e) {
            record(new FieldException(key, path + " is not a number: '" + t + "'"));
        }
        return Double.NaN;
    }

    /** The whole number typed in the field at {@code path}; 0 (with the message recorded) when it is not one. */
    long whole(String path, String text) {
        return whole(path, path, text);
    }

    /** As {@link #whole(String, String)}, the message recorded under {@code key} and naming {@code path}. */
    long whole(String key, String path, String text) {
        String t = SettingsText.trim(text);
        try {
            return Long.parseLong(t);
        } catch (NumberFormatException e) {
            record(new FieldException(key, path + " is not a whole number: '" + t + "'"));
            return 0;
        }
    }

    /**
     * The scenario's cross-field refusal ({@code invalid scenario:} then one {@code path: message}
     * line per problem) placed at the first problem's path, as one line.
     */
    static FieldException fromProblems(IllegalArgumentException e) {
        String m = e.getMessage() == null ? "" : e.getMessage();
        String[] lines = m.split("\n");
        String first = lines.length > 1 ? lines[1].trim() : lines[0].trim();
        int colon = first.indexOf(": ");
        String path = colon > 0 && first.indexOf(' ') >= colon ? first.substring(0, colon) : "";
        return new FieldException(path, SettingsText.oneLine(m));
    }

    /**
     * A core validation message made one line and expressed in the file's names: a message that
     * starts with a record component ({@code symbolTimeS must be finite and > 0, got -3.0}) becomes
     * {@code <prefix>.symbol_time_s must be finite and > 0, got -3.0} at that path; any other message
     * is prefixed with {@code prefix} and placed at {@code fallback}.
     */
    static FieldException translate(String prefix, String fallback, IllegalArgumentException e) {
        if (e instanceof FieldException f) {
            return f;
        }
        String m = SettingsText.oneLine(e.getMessage());
        int end = 0;
        while (end < m.length() && Character.isLetterOrDigit(m.charAt(end))) {
            end++;
        }
        String name = FILE_NAMES.get(m.substring(0, end));
        if (name != null) {
            String path = prefix + "." + name;
            String rest = m.substring(end);
            return new FieldException(path, path + (rest.startsWith(":") ? rest.substring(1) : rest));
        }
        return new FieldException(fallback, prefix + ": " + m);
    }
}
