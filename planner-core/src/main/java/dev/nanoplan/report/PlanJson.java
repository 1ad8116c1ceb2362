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
import java.util.List;

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
 * <p>JSON has no NaN or infinity: every non-finite number is written as {@code null}; so is a
 * budget's {@code molecules_per_symbol_needed} when it is unknown (negative in the record), and
 * an unreachable route's {@code bottleneck_link}. Cost O(total taps + links + routes + budgets).
 */
public final class PlanJson {

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
            ObjectNode r = route(plan.routes().get(i));
            SharedRates.Share sh = shares.get(i);
            number(r, "shared_rate_bits_per_s", sh.rateBitsPerS());
            text(r, "shared_at", sh.limitedAt());
            r.put("shared_with", sh.sharedWith());
            routes.add(r);
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
        number(o, "capacity_bits", l.capacityBits() == null ? Double.NaN : l.capacityBits());
        number(o, "capacity_prior_one", l.capacityPriorOne() == null ? Double.NaN : l.capacityPriorOne());
        number(o, "rate_bits_per_s", l.rateBitsPerS());
        if (l.minErrorThreshold() >= 0) {
            o.put("min_error_threshold", l.minErrorThreshold());
        } else {
            o.putNull("min_error_threshold");
        }
        number(o, "min_error_probability", l.minErrorProbability());
        o.put("count_blind", l.countBlind());
        impairment(o, "limited_by", l.limitedBy());
        text(o, "top_interferer", l.topInterferer());
        number(o, "log10_error_probability", l.log10ErrorProbability());
        number(o, "isi_mean", l.isiMean());
        number(o, "background_mean", l.backgroundMean());
        number(o, "top_interferer_share", l.topInterfererShare());
        number(o, "crossover_zero", l.crossoverZero());
        number(o, "crossover_one", l.crossoverOne());
        text(o, "model_caveat", l.modelCaveat());
        text(o, "channel", l.channel());
        text(o, "channel_reason", l.channelReason());
        return o;
    }

    /** One {@code routes} entry. */
    public static ObjectNode route(RouteReport r) {
        ObjectNode o = LinkJson.MAPPER.createObjectNode();
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
        }
        number(o, "end_to_end_capacity_bits", r.endToEndCapacityBits());
        number(o, "rate_bits_per_s", r.rateBitsPerS());
        number(o, "latency_s", r.latencyS());
        number(o, "direct_capacity_bits", r.directCapacityBits() == null ? Double.NaN : r.directCapacityBits());
        o.put("reachable", r.reachable());
        impairment(o, "limited_by", r.bottleneckLimitedBy());
        text(o, "advice", r.advice());
        return o;
    }

    /** One {@code budgets} entry. */
    public static ObjectNode budget(BudgetReport b) {
        ObjectNode o = LinkJson.MAPPER.createObjectNode();
        o.put("node", b.node());
        if (b.moleculesPerSymbolNeeded() >= 0) {
            o.put("molecules_per_symbol_needed", b.moleculesPerSymbolNeeded());
        } else {
            o.putNull("molecules_per_symbol_needed");
        }
        number(o, "molecules_per_s", b.moleculesPerS());
        number(o, "molecules_per_mission", b.moleculesPerMission());
        o.put("feasible", b.feasible());
        text(o, "reason", b.reason());
        o.put("method", b.method());
        o.put("count_blind_target", b.countBlindTarget());
        return o;
    }

    private static void number(ObjectNode o, String key, double v) {
        if (Double.isFinite(v)) {
            o.put(key, v);
        } else {
            o.putNull(key);
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
