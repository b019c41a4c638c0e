package dev.reweigh.examples.demo;

import java.nio.file.Path;
import java.util.Objects;

/**
 * What the demo simulates and where it writes: portfolio size, seed and output folder.
 *
 * <pre>{@code
 * DemoSettings s = DemoSettings.defaults().withOutput(Path.of("out")).withPolicies(20_000);
 * }</pre>
 *
 * @since 0.1
 */
public final class DemoSettings {
    /** The default output folder. */
    public static final String DEFAULT_OUTPUT = "reweigh-demo-out";

    private final int policies;
    private final long seed;
    private final Path output;

    private DemoSettings(int policies, long seed, Path output) {
        this.policies = policies;
        this.seed = seed;
        this.output = output;
    }

    /**
     * Returns the demo's own settings: 100,000 policies, the fixed seed, output to
     * {@code reweigh-demo-out/}.
     *
     * @return the settings
     * @since 0.1
     */
    public static DemoSettings defaults() {
        return new DemoSettings(MotorPortfolio.DEFAULT_POLICIES, MotorPortfolio.DEFAULT_SEED, Path.of(DEFAULT_OUTPUT));
    }

    /**
     * Returns settings with another portfolio size.
     *
     * @param n the number of policies, at least 2,000 (the smaller portfolios leave too few claims
     *     per level to show anything)
     * @return new settings
     * @throws IllegalArgumentException when n is below 2,000
     * @since 0.1
     */
    public DemoSettings withPolicies(int n) {
        if (n < 2_000) {
            throw new IllegalArgumentException("the demo needs at least 2000 policies, got " + n);
        }
        return new DemoSettings(n, seed, output);
    }

    /**
     * Returns settings with another seed.
     *
     * @param newSeed the seed
     * @return new settings
     * @since 0.1
     */
    public DemoSettings withSeed(long newSeed) {
        return new DemoSettings(policies, newSeed, output);
    }

    /**
     * Returns settings with another output folder.
     *
     * @param folder the folder (created when absent)
     * @return new settings
     * @since 0.1
     */
    public DemoSettings withOutput(Path folder) {
        return new DemoSettings(policies, seed, Objects.requireNonNull(folder, "folder"));
    }

    /**
     * Returns the number of policies.
     *
     * @return the portfolio size
     * @since 0.1
     */
    public int policies() {
        return policies;
    }

    /**
     * Returns the seed.
     *
     * @return the seed
     * @since 0.1
     */
    public long seed() {
        return seed;
    }

    /**
     * Returns the output folder.
     *
     * @return the folder
     * @since 0.1
     */
    public Path output() {
        return output;
    }
}
