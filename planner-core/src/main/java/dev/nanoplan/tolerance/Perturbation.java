package dev.nanoplan.tolerance;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.physics.StokesEinstein;
import dev.nanoplan.scenario.Medium;
import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.Species;
import dev.nanoplan.scenario.Tolerances;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.apache.commons.math3.random.SobolSequenceGenerator;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.apache.commons.statistics.distribution.NormalDistribution;

/**
 * Draws perturbed layouts of a scenario from its {@link Tolerances}: sample {@code index} is a pure
 * function of (nominal scenario, sampler, seed, index), so samples can be drawn in any order, on any
 * thread or machine, and give the same layouts.
 *
 * <p><b>Draws.</b> One standard-normal z per {@link ToleranceFactor}, truncated at ±4 by inversion:
 * z = Φ⁻¹(Φ(−4) + u·(Φ(4) − Φ(−4))) for a unit-cube coordinate u (the exact truncated normal; the
 * inverse CDF is Commons Statistics' {@code NormalDistribution}). The points u are Sobol' point
 * {@code index + 1} (the all-zero first point is skipped) shifted modulo 1 by a seeded random vector,
 * or seeded pseudo-random points (stream keyed by seed and index).
 *
 * <p><b>Applied.</b> Position: nominal + sd·z on each axis. Radius r·(1 + sd·z), molecules
 * n·(1 + sd·z) rounded, at least 1 for emitters; radii at least 1 % of nominal (a spread below 25 %
 * never reaches that bound with |z| ≤ 4). Temperature T + sd·z (at least 1 K); a species given by its
 * hydrodynamic radius follows through Stokes–Einstein at the drawn temperature (viscosity fixed), then
 * every species' D is scaled by (1 + sd·z) of its own factor.
 *
 * <p><b>Redraws.</b> A draw that puts a body outside the volume or overlapping another (the checks
 * of {@link Scenario}) is redrawn from a pseudo-random stream keyed by (seed, index, attempt), and
 * the attempts are counted. Thread-safe.
 */
public final class Perturbation {

    /** Truncation of the normal draws, in standard deviations. */
    public static final double TRUNCATION = 4.0;
    /** Redraws allowed per sample before the tolerances are judged too wide for the layout. */
    public static final int MAX_REDRAWS = 1000;
    /** Most factors the Sobol' generator supports (Commons Math's direction numbers). */
    public static final int MAX_SOBOL_FACTORS = 1000;

    private static final NormalDistribution NORMAL = NormalDistribution.of(0, 1);
    private static final double LOW = NORMAL.cumulativeProbability(-TRUNCATION);
    private static final double HIGH = NORMAL.cumulativeProbability(TRUNCATION);

    private final Scenario nominal;
    private final Sampler sampler;
    private final long seed;
    private final List<ToleranceFactor> factors;
    private final SobolSequenceGenerator sobol;
    private final double[] shift;

    /**
     * @throws IllegalArgumentException if Sobol' points are asked for more than
     *     {@value #MAX_SOBOL_FACTORS} factors
     */
    public Perturbation(Scenario nominal, Sampler sampler, long seed) {
        this.nominal = nominal;
        this.sampler = sampler;
        this.seed = seed;
        this.factors = factorsOf(nominal);
        int k = factors.size();
        if (sampler == Sampler.SOBOL && k > MAX_SOBOL_FACTORS) {
            throw new IllegalArgumentException("--sampler: sobol covers at most " + MAX_SOBOL_FACTORS
                    + " varied inputs, this layout has " + k + "; use --sampler random");
        }
        this.sobol = sampler == Sampler.SOBOL && k > 0 ? new SobolSequenceGenerator(k) : null;
        this.shift = new double[k];
        UniformRandomProvider rng = stream(seed, -1, 0);
        for (int j = 0; j < k; j++) {
            shift[j] = rng.nextDouble();
        }
    }

    /** The varied inputs, in a fixed order: nodes in file order (x, y, z, radius, molecules), species, temperature. */
    public static List<ToleranceFactor> factorsOf(Scenario s) {
        Tolerances t = s.tolerances();
        List<ToleranceFactor> out = new ArrayList<>();
        for (Node n : s.nodes()) {
            Tolerances.NodeSpread sp = t.of(n.id());
            if (sp.positionSdUm() > 0) {
                for (int a = 0; a < 3; a++) {
                    out.add(new ToleranceFactor(ToleranceFactor.Kind.POSITION, n.id(), a, sp.positionSdUm()));
                }
            }
            if (sp.radiusPercent() > 0) {
                out.add(new ToleranceFactor(ToleranceFactor.Kind.RADIUS, n.id(), 0, sp.radiusPercent() / 100));
            }
            if (sp.moleculesPercent() > 0 && n.role().emits()) {
                out.add(new ToleranceFactor(ToleranceFactor.Kind.MOLECULES, n.id(), 0, sp.moleculesPercent() / 100));
            }
        }
        if (t.diffusionPercent() > 0) {
            for (Species sp : s.species()) {
                out.add(new ToleranceFactor(ToleranceFactor.Kind.DIFFUSION, sp.name(), 0, t.diffusionPercent() / 100));
            }
        }
        if (t.temperatureK() > 0 && s.species().stream().anyMatch(sp -> sp.hydrodynamicRadiusNm().isPresent())) {
            out.add(new ToleranceFactor(ToleranceFactor.Kind.TEMPERATURE, "medium", 0, t.temperatureK()));
        }
        return List.copyOf(out);
    }

    /** The varied inputs of this study. */
    public List<ToleranceFactor> factors() {
        return factors;
    }

    /** The unperturbed scenario. */
    public Scenario nominal() {
        return nominal;
    }

    /**
     * A perturbed layout.
     *
     * @param scenario the layout
     * @param z        the standard-normal draw of each factor (after redraws)
     * @param redraws  how many draws were rejected before this one
     */
    public record Draw(Scenario scenario, double[] z, int redraws) {
        public Draw {
            z = z.clone();
        }

        @Override
        public double[] z() {
            return z.clone();
        }

        @Override
        public boolean equals(Object o) {
            return o instanceof Draw d && scenario.equals(d.scenario) && Arrays.equals(z, d.z) && redraws == d.redraws;
        }

        @Override
        public int hashCode() {
            return 31 * (31 * scenario.hashCode() + Arrays.hashCode(z)) + redraws;
        }
    }

    /**
     * Sample {@code index} (≥ 0).
     *
     * @throws IllegalArgumentException if no placement without overlaps or bodies outside the volume was
     *     found in {@value #MAX_REDRAWS} redraws
     */
    public Draw draw(int index) {
        if (index < 0) {
            throw new IllegalArgumentException("index must be >= 0, got " + index);
        }
        double[] u = firstPoint(index);
        for (int attempt = 0; attempt <= MAX_REDRAWS; attempt++) {
            if (attempt > 0) {
                UniformRandomProvider rng = stream(seed, index, attempt);
                for (int j = 0; j < u.length; j++) {
                    u[j] = rng.nextDouble();
                }
            }
            double[] z = new double[u.length];
            for (int j = 0; j < u.length; j++) {
                z[j] = truncatedNormal(u[j]);
            }
            Scenario s = apply(z);
            if (s != null) {
                return new Draw(s, z, attempt);
            }
        }
        throw new IllegalArgumentException("tolerances.position_sd_um: no layout without overlapping bodies or "
                + "bodies outside the volume in " + MAX_REDRAWS + " draws of sample " + index
                + "; the position spread is too wide for this layout");
    }

    /** The standard normal truncated at ±{@value #TRUNCATION} at unit-cube coordinate u ∈ [0, 1). */
    static double truncatedNormal(double u) {
        double p = LOW + u * (HIGH - LOW);
        return Math.max(-TRUNCATION, Math.min(TRUNCATION, NORMAL.inverseCumulativeProbability(p)));
    }

    private double[] firstPoint(int index) {
        int k = factors.size();
        if (sobol == null) {
            double[] u = new double[k];
            UniformRandomProvider rng = stream(seed, index, 0);
            for (int j = 0; j < k; j++) {
                u[j] = rng.nextDouble();
            }
            return u;
        }
        double[] x;
        synchronized (sobol) {
            x = sobol.skipTo(index + 1);
        }
        for (int j = 0; j < k; j++) {
            double v = x[j] + shift[j];
            x[j] = v >= 1 ? v - 1 : v;
        }
        return x;
    }

    /** The layout at draws z, or null if a body lands outside the volume or on another. */
    Scenario apply(double[] z) {
        int k = factors.size();
        List<Node> nodes = new ArrayList<>(nominal.nodes());
        double temperature = nominal.medium().temperatureK();
        double[] diffusionFactor = new double[nominal.species().size()];
        Arrays.fill(diffusionFactor, 1);
        int j = 0;
        for (int i = 0; i < nodes.size() && j < k; i++) {
            Node n = nodes.get(i);
            double[] pos = n.positionUm().toArray();
            double radius = n.radiusUm();
            long molecules = n.moleculesPerSymbol();
            boolean changed = false;
            while (j < k && factors.get(j).subject().equals(n.id()) && factors.get(j).kind() != ToleranceFactor.Kind.DIFFUSION
                    && factors.get(j).kind() != ToleranceFactor.Kind.TEMPERATURE) {
                ToleranceFactor f = factors.get(j);
                double v = f.sd() * z[j];
                switch (f.kind()) {
                    case POSITION -> pos[f.axis()] += v;
                    case RADIUS -> radius = n.radiusUm() * Math.max(0.01, 1 + v);
                    default -> molecules = Math.max(1, Math.round(n.moleculesPerSymbol() * (1 + v)));
                }
                changed = true;
                j++;
            }
            if (changed) {
                nodes.set(i, new Node(n.id(), n.role(), Vec3.of(pos), radius, n.species(), n.emitsSpecies(), molecules,
                        n.fixed(), n.receiver()));
            }
        }
        for (; j < k; j++) {
            ToleranceFactor f = factors.get(j);
            if (f.kind() == ToleranceFactor.Kind.TEMPERATURE) {
                temperature = Math.max(1.0, temperature + f.sd() * z[j]);
            } else {
                int s = speciesIndex(f.subject());
                diffusionFactor[s] = Math.max(0.01, 1 + f.sd() * z[j]);
            }
        }
        Medium m = nominal.medium();
        Medium medium = temperature == m.temperatureK() ? m
                : new Medium(temperature, m.viscosityMPaS(), m.flow(), m.backgroundMoleculesPerS());
        List<Species> species = new ArrayList<>(nominal.species().size());
        for (int s = 0; s < nominal.species().size(); s++) {
            Species sp = nominal.species().get(s);
            double d = sp.diffusionUm2PerS();
            if (medium != m && sp.hydrodynamicRadiusNm().isPresent()) {
                d = StokesEinstein.diffusionUm2PerS(temperature, m.viscosityMPaS(), sp.hydrodynamicRadiusNm().getAsDouble());
            }
            species.add(d == sp.diffusionUm2PerS() && diffusionFactor[s] == 1 ? sp
                    : new Species(sp.name(), d * diffusionFactor[s], sp.hydrodynamicRadiusNm(), sp.halfLifeS()));
        }
        try {
            return new Scenario(nominal.name(), nominal.volume(), medium, species, nominal.signalling(), nodes,
                    nominal.demands(), nominal.targets(), nominal.candidateSpecies(), nominal.tolerances());
        } catch (IllegalArgumentException e) {
            return null;
        }
    }

    private int speciesIndex(String name) {
        for (int s = 0; s < nominal.species().size(); s++) {
            if (nominal.species().get(s).name().equals(name)) {
                return s;
            }
        }
        throw new IllegalStateException("unknown species " + name);
    }

    /** A pseudo-random stream keyed by (seed, index, attempt), the keys mixed by the SplitMix64 finaliser. */
    static UniformRandomProvider stream(long seed, long index, long attempt) {
        return RandomSource.XO_RO_SHI_RO_128_PP.create(new long[] {mix(seed ^ mix(attempt + 0x632BE59BD9B4E019L)),
            mix(index + 0x9E3779B97F4A7C15L * (seed + 1))});
    }

    /** SplitMix64's output function (G. L. Steele, D. Lea, C. H. Flood, OOPSLA 2014). */
    private static long mix(long z) {
        z = (z ^ (z >>> 30)) * 0xBF58476D1CE4E5B9L;
        z = (z ^ (z >>> 27)) * 0x94D049BB133111EBL;
        return z ^ (z >>> 31);
    }
}
