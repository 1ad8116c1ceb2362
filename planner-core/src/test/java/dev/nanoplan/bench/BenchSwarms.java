package dev.nanoplan.bench;

import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.SwarmGenerator;

/**
 * The generated swarms the benchmarks plan: by default {@link SwarmGenerator#designed} (cells of a
 * gateway, relays and sensor groups, where most demands route); with
 * {@code -Dnanoplan.bench.layout=lattice} the random lattice of {@link SwarmGenerator#generate} (mostly
 * disconnected: e.g. 3 of 720 demands route at 1,000 nodes), as earlier measurements used.
 */
final class BenchSwarms {

    private BenchSwarms() {
    }

    static Scenario swarm(int nodes, long seed) {
        return "lattice".equals(System.getProperty("nanoplan.bench.layout")) ? SwarmGenerator.generate(nodes, seed)
                : SwarmGenerator.designed(nodes, seed);
    }
}
