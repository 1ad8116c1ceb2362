package dev.nanoplan.report;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.nanoplan.plan.BudgetReport;
import dev.nanoplan.plan.Impairment;
import dev.nanoplan.plan.LinkReport;
import dev.nanoplan.plan.Plan;
import dev.nanoplan.plan.RouteReport;
import dev.nanoplan.plan.SharedRates;
import dev.nanoplan.plan.SlotSchedule;
import dev.nanoplan.scenario.Node;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The {@code plan --json} object of docs/architecture.md §4.3 (stable snake_case keys; more may be added).
 *
 * <p>Top level: {@code scenario} (name), {@code channel}, {@code symbol_time_s}, {@code schedule}
 * ({@code all-active}, {@code round-robin} or {@code slots}: then link rates are per frame of K slots),
 * {@code frame_slots} (the longest frame over the species, 1 under all-active), {@code slots} (every
 * emitter's slot by node id: 0 under all-active, file order within its species under round-robin),
 * {@code links},
 * {@code routes}, {@code budgets}, {@code warnings}, {@code assumptions} ({@link Cautions#ASSUMPTIONS}),
 * {@code caution} ({@link Cautions#SHORT}).
 *
 * <p>Extras beyond the contract — links: {@code log10_error_probability}, {@code isi_mean},
 * {@code background_mean}, {@code top_interferer_share}, {@code crossover_zero},
 * {@code crossover_one}, {@code model_caveat}; routes: {@code reachable}, {@code limited_by},
 * {@code advice}, and the rate when routes share emitters ({@link SharedRates}):
 * {@code shared_rate_bits_per_s}, {@code shared_at} (the emitter whose stream is used up, or
 * null) and {@code shared_with} (demands through it).
 *
 * <p>No sentinels: a value that does not exist or is not known is {@code null} (JSON has no NaN or
 * infinity either), and every link, route and budget entry ends with {@value #NULL_REASONS}, an object
 * giving for each of its null keys the reason in words (e.g. a budget out of reach has
 * {@code molecules_per_symbol_needed}, {@code molecules_per_s} and {@code molecules_per_mission} null;
 * an unreachable route has {@code latency_s}, {@code bottleneck_link} and {@code limited_by} null).
 * Cost O(total taps + links + routes + budgets).
 */
public final class PlanJson {

    /** Key of the object, in every link, route and budget entry, that says why each null value is null. */
    public static final String NULL_REASONS = "null_reasons";

    private PlanJson() {
    }

    /** The whole plan as one JSON object. */
    public static ObjectNode of(Plan plan) {
        ObjectNode o = LinkJson.MAPPER.createObjectNode();
        o.put("scenario", plan.scenario().name());
        o.put("channel", plan.channel());
        number(o, "symbol_time_s", plan.scenario().signalling().symbolTimeS());
        o.put("schedule", plan.scenario().signalling().schedule().id());
        SlotSchedule schedule = SlotSchedule.of(plan.scenario());
        o.put("frame_slots", schedule.longestFrame());
        ObjectNode slots = o.putObject("slots");
        for (Node n : plan.scenario().nodes()) {
            if (n.role().emits()) {
                slots.put(n.id(), schedule.slotOf(n.id()));
            }
        }
        ArrayNode links = o.putArray("links");
        for (LinkReport l : plan.links()) {
            links.add(link(l));
        }
        ArrayNode routes = o.putArray("routes");
        List<SharedRates.Share> shares = SharedRates.of(plan);
        for (int i = 0; i < plan.routes().size(); i++) {
            routes.add(route(plan.routes().get(i), shares.get(i)));
        }
        ArrayNode budgets = o.putArray("budgets");
        for (BudgetReport b : plan.budgets()) {
            budgets.add(budget(b));
        }
        ArrayNode warnings = o.putArray("warnings");
        plan.warnings().forEach(warnings::add);
        ArrayNode assumptions = o.putArray("assumptions");
        Cautions.ASSUMPTIONS.forEach(assumptions::add);
        o.put("caution", Cautions.SHORT);
        return o;
    }

    /** One {@code links} entry. */
    public static ObjectNode link(LinkReport l) {
        ObjectNode o = LinkJson.MAPPER.createObjectNode();
        Why why = new Why();
        o.put("from", l.from());
        o.put("to", l.to());
        o.put("species", l.species());
        number(o, "hit_probability", l.hitProbability());
        ArrayNode taps = o.putArray("taps");
        for (double t : l.taps()) {
            if (Double.isFinite(t)) {
                taps.add(t);
            } else {
                taps.addNull();
            }
        }
        number(o, "signal_mean", l.signalMean());
        number(o, "interference_mean", l.interferenceMean());
        o.put("threshold", l.threshold());
        number(o, "error_probability", l.errorProbability());
        number(o, "mutual_information_bits", l.mutualInformationBits());
        String noCapacity = "computed for route hops only (and not in the preview)";
        number(o, "capacity_bits", l.capacityBits() == null ? Double.NaN : l.capacityBits(), why, noCapacity);
        number(o, "capacity_prior_one", l.capacityPriorOne() == null ? Double.NaN : l.capacityPriorOne(), why,
                l.capacityBits() == null ? noCapacity : "more than two levels: see the input distribution");
        number(o, "rate_bits_per_s", l.rateBitsPerS());
        if (l.minErrorThreshold() >= 0) {
            o.put("min_error_threshold", l.minErrorThreshold());
        } else {
            o.putNull("min_error_threshold");
            why.put("min_error_threshold", "more than two levels: the minimum error is the MAP symbol decision, "
                    + "not one threshold");
        }
        number(o, "min_error_probability", l.minErrorProbability());
        o.put("count_blind", l.countBlind());
        impairment(o, "limited_by", l.limitedBy());
        text(o, "top_interferer", l.topInterferer(), why, "no other emitter is heard at this receiver");
        number(o, "log10_error_probability", l.log10ErrorProbability());
        number(o, "isi_mean", l.isiMean());
        number(o, "background_mean", l.backgroundMean());
        number(o, "top_interferer_share", l.topInterfererShare());
        number(o, "crossover_zero", l.crossoverZero());
        number(o, "crossover_one", l.crossoverOne());
        text(o, "model_caveat", l.modelCaveat(), why, "none: no walls or flow the closed forms leave out");
        text(o, "channel", l.channel());
        text(o, "channel_reason", l.channelReason());
        why.into(o);
        return o;
    }

    /** One {@code routes} entry. */
    public static ObjectNode route(RouteReport r) {
        return route(r, null);
    }

    /** One {@code routes} entry with its shared rate ({@link SharedRates}; null to leave it out). */
    static ObjectNode route(RouteReport r, SharedRates.Share sh) {
        ObjectNode o = LinkJson.MAPPER.createObjectNode();
        Why why = new Why();
        String unreachable = "unreachable: " + r.advice();
        o.put("from", r.from());
        o.put("to", r.to());
        ArrayNode hops = o.putArray("hops");
        r.hops().forEach(hops::add);
        number(o, "bottleneck_capacity_bits", r.bottleneckCapacityBits());
        if (r.bottleneckFrom() != null && r.bottleneckTo() != null) {
            ObjectNode b = o.putObject("bottleneck_link");
            b.put("from", r.bottleneckFrom());
            b.put("to", r.bottleneckTo());
        } else {
            o.putNull("bottleneck_link");
            why.put("bottleneck_link", unreachable);
        }
        number(o, "end_to_end_capacity_bits", r.endToEndCapacityBits());
        number(o, "rate_bits_per_s", r.rateBitsPerS());
        number(o, "latency_s", r.reachable() ? r.latencyS() : Double.NaN, why, unreachable);
        number(o, "direct_capacity_bits", r.directCapacityBits() == null ? Double.NaN : r.directCapacityBits(), why,
                "no direct link above the capacity floor");
        o.put("reachable", r.reachable());
        if (r.bottleneckLimitedBy() == null) {
            o.putNull("limited_by");
            why.put("limited_by", unreachable);
        } else {
            o.put("limited_by", r.bottleneckLimitedBy().id());
        }
        text(o, "advice", r.advice());
        if (sh != null) {
            number(o, "shared_rate_bits_per_s", sh.rateBitsPerS());
            text(o, "shared_at", sh.limitedAt(), why, r.reachable()
                    ? "no shared emitter limits this demand: it gets the rate it would have alone" : unreachable);
            o.put("shared_with", sh.sharedWith());
        }
        why.into(o);
        return o;
    }

    /** One {@code budgets} entry. */
    public static ObjectNode budget(BudgetReport b) {
        ObjectNode o = LinkJson.MAPPER.createObjectNode();
        Why why = new Why();
        o.put("node", b.node());
        boolean sized = b.moleculesPerSymbolNeeded() >= 0;
        String notSized = b.feasible() ? "not sized: see reason" : "out of reach: see reason";
        if (sized) {
            o.put("molecules_per_symbol_needed", b.moleculesPerSymbolNeeded());
        } else {
            o.putNull("molecules_per_symbol_needed");
            why.put("molecules_per_symbol_needed", notSized);
        }
        number(o, "molecules_per_s", sized ? b.moleculesPerS() : Double.NaN, why, notSized);
        number(o, "molecules_per_mission", sized ? b.moleculesPerMission() : Double.NaN, why, sized
                ? "beyond the range of a double (about 1.8e308): the mission is too long to total" : notSized);
        o.put("feasible", b.feasible());
        text(o, "reason", b.reason());
        o.put("method", b.method());
        o.put("count_blind_target", b.countBlindTarget());
        why.into(o);
        return o;
    }

    private static void number(ObjectNode o, String key, double v) {
        if (Double.isFinite(v)) {
            o.put(key, v);
        } else {
            o.putNull(key);
        }
    }

    /** As {@link #number(ObjectNode, String, double)}; a null is explained in {@code why}. */
    private static void number(ObjectNode o, String key, double v, Why why, String reason) {
        number(o, key, v);
        if (!Double.isFinite(v)) {
            why.put(key, reason);
        }
    }

    /** As {@link #text(ObjectNode, String, String)}; a null is explained in {@code why}. */
    private static void text(ObjectNode o, String key, String v, Why why, String reason) {
        text(o, key, v);
        if (v == null) {
            why.put(key, reason);
        }
    }

    /**
     * The reasons of an entry's null values, written last as the sibling object {@value #NULL_REASONS}
     * (key of the null value → words), always present (empty when nothing is null).
     */
    private static final class Why {
        private final Map<String, String> reasons = new LinkedHashMap<>();

        void put(String key, String reason) {
            reasons.put(key, reason);
        }

        void into(ObjectNode o) {
            ObjectNode w = o.putObject(NULL_REASONS);
            reasons.forEach(w::put);
        }
    }

    private static void text(ObjectNode o, String key, String v) {
        if (v == null) {
            o.putNull(key);
        } else {
            o.put(key, v);
        }
    }

    private static void impairment(ObjectNode o, String key, Impairment i) {
        text(o, key, i == null ? null : i.id());
    }
}
