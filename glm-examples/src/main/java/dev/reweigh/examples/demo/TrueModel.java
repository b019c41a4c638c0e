package dev.reweigh.examples.demo;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.OptionalDouble;

/**
 * The known models the demo portfolio is simulated from: claim frequency Poisson with a log link
 * (per policy-year, times exposure), individual claim amounts Gamma with a log link and a known
 * shape. Each rating factor has a base level whose relativity is 1, so the true coefficient of a
 * model column {@code factor=level} is log(relativity) when the fit uses the same base levels.
 *
 * @since 0.1
 */
public final class TrueModel {
    /** Column names of the simulated portfolio. */
    public static final String EXPOSURE = "exposure";
    /** Driver age band (factor). */
    public static final String DRIVER_AGE = "driver_age";
    /** Vehicle power group (factor). */
    public static final String POWER = "vehicle_power";
    /** Region (factor, twelve levels). */
    public static final String REGION = "region";
    /** Annual mileage in thousands of kilometres (numeric). */
    public static final String MILEAGE = "mileage_k";
    /** Number of claims in the policy period. */
    public static final String CLAIMS = "claims";
    /** Total of the claim amounts. */
    public static final String CLAIM_TOTAL = "claim_total";
    /** Average claim amount (claim_total / claims), missing when there is no claim. */
    public static final String AVERAGE_CLAIM = "average_claim";
    /** Loss cost per policy-year (claim_total / exposure). */
    public static final String LOSS_COST = "loss_cost";

    private final double frequencyBase;
    private final double mileageSlope;
    private final double severityBase;
    private final double severityShape;
    private final Map<String, Map<String, Double>> frequencyRelativities;
    private final Map<String, Map<String, Double>> severityRelativities;
    private final Map<String, Map<String, Double>> mix;
    private final Map<String, String> baseLevels;

    private TrueModel() {
        frequencyBase = 0.055;
        mileageSlope = 0.018;
        severityBase = 2_400;
        severityShape = 1.6;
        baseLevels = Map.of(DRIVER_AGE, "35-49", POWER, "G3", REGION, "metro-central");
        frequencyRelativities = new LinkedHashMap<>();
        severityRelativities = new LinkedHashMap<>();
        mix = new LinkedHashMap<>();
        List<String> ages = List.of("18-24", "25-34", "35-49", "50-64", "65+");
        put(DRIVER_AGE, ages, new double[] {0.08, 0.20, 0.32, 0.25, 0.15},
                new double[] {1.85, 1.30, 1.00, 0.88, 1.05},
                new double[] {1.00, 1.00, 1.00, 1.00, 1.00}); // age does not move severity
        List<String> power = List.of("G1", "G2", "G3", "G4", "G5");
        put(POWER, power, new double[] {0.15, 0.25, 0.30, 0.20, 0.10},
                new double[] {0.85, 0.94, 1.00, 1.12, 1.30},
                new double[] {0.80, 0.90, 1.00, 1.20, 1.45});
        List<String> regions = List.of("metro-central", "metro-north", "metro-south", "coast-east", "coast-west",
                "lakes", "highlands", "plains-north", "plains-south", "valley", "islands", "border");
        put(REGION, regions,
                new double[] {0.20, 0.11, 0.11, 0.08, 0.08, 0.07, 0.05, 0.08, 0.07, 0.07, 0.03, 0.05},
                new double[] {1.00, 0.92, 1.08, 0.85, 0.80, 0.75, 0.70, 0.78, 0.82, 0.88, 0.72, 0.95},
                new double[] {1.00, 0.97, 1.05, 0.95, 0.93, 0.90, 0.88, 0.90, 0.92, 0.94, 1.10, 0.96});
    }

    private void put(String factor, List<String> levels, double[] shares, double[] freq, double[] sev) {
        Map<String, Double> f = new LinkedHashMap<>();
        Map<String, Double> s = new LinkedHashMap<>();
        Map<String, Double> m = new LinkedHashMap<>();
        for (int i = 0; i < levels.size(); i++) {
            f.put(levels.get(i), freq[i]);
            s.put(levels.get(i), sev[i]);
            m.put(levels.get(i), shares[i]);
        }
        frequencyRelativities.put(factor, f);
        severityRelativities.put(factor, s);
        mix.put(factor, m);
    }

    /**
     * Returns the demo's true model.
     *
     * @return the model
     * @since 0.1
     */
    public static TrueModel standard() {
        return new TrueModel();
    }

    /**
     * Returns the rating factors, in model order.
     *
     * @return driver age band, vehicle power group, region
     * @since 0.1
     */
    public List<String> factors() {
        return List.of(DRIVER_AGE, POWER, REGION);
    }

    /**
     * Returns the levels of a factor, in their natural order.
     *
     * @param factor a factor name
     * @return the levels
     * @since 0.1
     */
    public List<String> levels(String factor) {
        return List.copyOf(mix.get(Objects.requireNonNull(factor)).keySet());
    }

    /**
     * Returns the base level (relativity 1) of a factor; the demo fits use it as reference.
     *
     * @param factor a factor name
     * @return the base level
     * @since 0.1
     */
    public String baseLevel(String factor) {
        return baseLevels.get(factor);
    }

    /**
     * Returns the share of policies in each level of a factor.
     *
     * @param factor a factor name
     * @return level to share, in level order
     * @since 0.1
     */
    public Map<String, Double> mix(String factor) {
        return Map.copyOf(mix.get(factor));
    }

    /**
     * Returns the true frequency relativity of a level.
     *
     * @param factor a factor name
     * @param level one of its levels
     * @return the relativity to the base level
     * @since 0.1
     */
    public double frequencyRelativity(String factor, String level) {
        return frequencyRelativities.get(factor).get(level);
    }

    /**
     * Returns the true severity relativity of a level.
     *
     * @param factor a factor name
     * @param level one of its levels
     * @return the relativity to the base level
     * @since 0.1
     */
    public double severityRelativity(String factor, String level) {
        return severityRelativities.get(factor).get(level);
    }

    /**
     * Returns the claim frequency per policy-year of the base levels at zero mileage.
     *
     * @return the base frequency
     * @since 0.1
     */
    public double frequencyBase() {
        return frequencyBase;
    }

    /**
     * Returns the change of log frequency per thousand kilometres.
     *
     * @return the mileage coefficient
     * @since 0.1
     */
    public double mileageSlope() {
        return mileageSlope;
    }

    /**
     * Returns the mean claim amount of the base levels.
     *
     * @return the base severity
     * @since 0.1
     */
    public double severityBase() {
        return severityBase;
    }

    /**
     * Returns the Gamma shape of one claim amount; the severity dispersion is its inverse.
     *
     * @return the shape
     * @since 0.1
     */
    public double severityShape() {
        return severityShape;
    }

    /**
     * Returns the true severity dispersion, 1 / shape.
     *
     * @return the dispersion
     * @since 0.1
     */
    public double severityDispersion() {
        return 1 / severityShape;
    }

    /**
     * Returns the expected claims per policy-year.
     *
     * @param age driver age band
     * @param power vehicle power group
     * @param region region
     * @param mileage thousands of kilometres a year
     * @return the frequency
     * @since 0.1
     */
    public double frequency(String age, String power, String region, double mileage) {
        return frequencyBase * frequencyRelativity(DRIVER_AGE, age) * frequencyRelativity(POWER, power)
                * frequencyRelativity(REGION, region) * Math.exp(mileageSlope * mileage);
    }

    /**
     * Returns the expected amount of one claim.
     *
     * @param age driver age band
     * @param power vehicle power group
     * @param region region
     * @return the severity
     * @since 0.1
     */
    public double severity(String age, String power, String region) {
        return severityBase * severityRelativity(DRIVER_AGE, age) * severityRelativity(POWER, power)
                * severityRelativity(REGION, region);
    }

    /**
     * Returns the true coefficient of a frequency model column (with the base levels as reference):
     * {@code intercept}, {@code mileage_k} or {@code factor=level}.
     *
     * @param column a model column name
     * @return the coefficient, empty when the column is not one of the true model's
     * @since 0.1
     */
    public OptionalDouble frequencyCoefficient(String column) {
        if (column.equals("intercept")) {
            return OptionalDouble.of(Math.log(frequencyBase));
        }
        if (column.equals(MILEAGE)) {
            return OptionalDouble.of(mileageSlope);
        }
        return levelCoefficient(column, frequencyRelativities);
    }

    /**
     * Returns the true coefficient of a severity model column (with the base levels as reference):
     * {@code intercept} or {@code factor=level}; mileage has no effect on severity.
     *
     * @param column a model column name
     * @return the coefficient, empty when the column is not one of the true model's
     * @since 0.1
     */
    public OptionalDouble severityCoefficient(String column) {
        if (column.equals("intercept")) {
            return OptionalDouble.of(Math.log(severityBase));
        }
        if (column.equals(MILEAGE)) {
            return OptionalDouble.of(0.0);
        }
        return levelCoefficient(column, severityRelativities);
    }

    private static OptionalDouble levelCoefficient(String column, Map<String, Map<String, Double>> relativities) {
        int eq = column.indexOf('=');
        if (eq < 0) {
            return OptionalDouble.empty();
        }
        Map<String, Double> levels = relativities.get(column.substring(0, eq));
        Double r = levels == null ? null : levels.get(column.substring(eq + 1));
        return r == null ? OptionalDouble.empty() : OptionalDouble.of(Math.log(r));
    }
}
