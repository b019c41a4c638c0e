package dev.reweigh.examples.demo;

import dev.reweigh.core.FittedModel;
import dev.reweigh.core.Glm;
import dev.reweigh.core.ModelSpec;
import dev.reweigh.core.Table;
import dev.reweigh.families.Families;
import dev.reweigh.families.Links;
import dev.reweigh.families.ReweighException;
import dev.reweigh.inference.CoefficientRow;
import dev.reweigh.inference.CoefficientTable;
import dev.reweigh.inference.ComparedModel;
import dev.reweigh.inference.Criterion;
import dev.reweigh.inference.DispersionEstimate;
import dev.reweigh.inference.DispersionMethod;
import dev.reweigh.inference.Inference;
import dev.reweigh.inference.InformationCriteria;
import dev.reweigh.inference.Interval;
import dev.reweigh.inference.LevelSummary;
import dev.reweigh.inference.LikelihoodRatioTest;
import dev.reweigh.inference.ModelComparison;
import dev.reweigh.inference.NegativeBinomialTheta;
import dev.reweigh.inference.Prediction;
import dev.reweigh.inference.PredictionTable;
import dev.reweigh.inference.ReferenceDistribution;
import dev.reweigh.inference.TweediePowerProfile;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import static dev.reweigh.examples.demo.TextGrid.fixed;
import static dev.reweigh.examples.demo.TextGrid.num;
import static dev.reweigh.examples.demo.TrueModel.AVERAGE_CLAIM;
import static dev.reweigh.examples.demo.TrueModel.CLAIMS;
import static dev.reweigh.examples.demo.TrueModel.CLAIM_TOTAL;
import static dev.reweigh.examples.demo.TrueModel.DRIVER_AGE;
import static dev.reweigh.examples.demo.TrueModel.EXPOSURE;
import static dev.reweigh.examples.demo.TrueModel.LOSS_COST;
import static dev.reweigh.examples.demo.TrueModel.MILEAGE;
import static dev.reweigh.examples.demo.TrueModel.POWER;
import static dev.reweigh.examples.demo.TrueModel.REGION;

/**
 * The end-to-end demo on a synthetic motor portfolio: claim frequency (Poisson against negative
 * binomial), claim severity (Gamma with log and identity links against Gaussian and inverse
 * Gaussian), dispersion three ways, likelihood-ratio tests of rating factors, relativities with
 * intervals, pure premiums of example policies, a Tweedie pure-premium model, the true parameters
 * beside the estimates, and files (model artifacts, scored policies, charts) in an output folder.
 *
 * <pre>{@code
 * DemoResult r = MotorDemo.run(DemoSettings.defaults(), new PrintWriter(System.out, true));
 * }</pre>
 *
 * @since 0.1
 */
public final class MotorDemo {
    /** The closing cautions, printed at the end of every run. */
    public static final List<String> CAUTIONS = List.of(
            "Everything above is statistical evidence, not actuarial sign-off.",
            "Rates built from these models need review by a qualified actuary before use, and must follow",
            "local insurance regulation, including the rules on which rating factors may be used at all",
            "(some places forbid or restrict factors such as age, gender or location).");

    private static final double LEVEL = 0.95;
    private static final System.Logger LOG = System.getLogger(MotorDemo.class.getName());

    private final DemoSettings settings;
    private final PrintWriter out;
    private final TrueModel truth = TrueModel.standard();
    private double tweedieProfilePower = Double.NaN; // set by the pure-premium step

    private MotorDemo(DemoSettings settings, PrintWriter out) {
        this.settings = settings;
        this.out = out;
    }

    /**
     * Runs the demo, printing its report and writing its files.
     *
     * @param settings portfolio size, seed and output folder
     * @param out where the report goes (flushed after each section)
     * @return the fits, estimates and files
     * @throws ReweighException when a fit fails or a file cannot be written
     * @since 0.1
     */
    public static DemoResult run(DemoSettings settings, PrintWriter out) {
        return new MotorDemo(settings, out).run();
    }

    /** The frequency model of the demo: Poisson, log link, the three factors and mileage, log(exposure) offset. */
    static ModelSpec frequencySpec(TrueModel truth) {
        return ModelSpec.builder(CLAIMS).family(Families.poisson()).link(Links.log())
                .factor(DRIVER_AGE, truth.baseLevel(DRIVER_AGE))
                .factor(POWER, truth.baseLevel(POWER))
                .factor(REGION, truth.baseLevel(REGION))
                .numeric(MILEAGE)
                .logOffset(EXPOSURE)
                .build();
    }

    /** The severity model of the demo: Gamma, log link, the three factors, claim counts as weights. */
    static ModelSpec severitySpec(TrueModel truth) {
        return ModelSpec.builder(AVERAGE_CLAIM).family(Families.gamma()).link(Links.log())
                .factor(DRIVER_AGE, truth.baseLevel(DRIVER_AGE))
                .factor(POWER, truth.baseLevel(POWER))
                .factor(REGION, truth.baseLevel(REGION))
                .weights(CLAIMS)
                .build();
    }

    /** The pure-premium model: Tweedie(p), log link, loss cost per policy-year weighted by exposure. */
    static ModelSpec tweedieSpec(TrueModel truth, double power) {
        return ModelSpec.builder(LOSS_COST).family(Families.tweedie(power)).link(Links.log())
                .factor(DRIVER_AGE, truth.baseLevel(DRIVER_AGE))
                .factor(POWER, truth.baseLevel(POWER))
                .factor(REGION, truth.baseLevel(REGION))
                .numeric(MILEAGE)
                .weights(EXPOSURE)
                .build();
    }

    private DemoResult run() {
        long started = System.nanoTime();
        DemoFiles.prepare(settings.output());
        MotorPortfolio portfolio = MotorPortfolio.simulate(truth, settings.policies(), settings.seed());
        Table policies = portfolio.policies();
        Table claimants = portfolio.policiesWithClaims();
        introduce(portfolio);

        section("1. Claim frequency: Poisson against negative binomial");
        FittedModel poisson = Glm.fit(frequencySpec(truth), policies);
        Inference frequency = Inference.of(poisson);
        NegativeBinomialTheta nb = frequencyModels(poisson, frequency);

        section("2. Average claim amount: four candidate models on the " + claimants.rowCount()
                + " policies with claims");
        FittedModel gammaLog = Glm.fit(severitySpec(truth), claimants);
        severityModels(gammaLog);

        section("3. Severity dispersion, three ways, and what the model implies per level");
        List<DispersionEstimate> dispersions = dispersions(gammaLog);
        Inference severity = Inference.of(gammaLog).withDispersion(DispersionMethod.MAXIMUM_LIKELIHOOD);
        levelSummary(severity);

        section("4. Does a rating factor earn its place? Likelihood-ratio tests");
        LikelihoodRatioTest sevAge = severity.likelihoodRatioTest(
                gammaLog.refit(gammaLog.spec().withoutTerm(DRIVER_AGE)));
        describeTest("severity without driver age", sevAge,
                "in the simulation driver age has no effect on claim amounts");
        LikelihoodRatioTest freqRegion = frequency.likelihoodRatioTest(
                poisson.refit(poisson.spec().withoutTerm(REGION)));
        describeTest("frequency without region", freqRegion,
                "in the simulation region moves claim frequency by factors from 0.70 to 1.08");

        section("5. Relativities (exp of the coefficients) with " + percent() + " intervals, beside the truth");
        List<Recovery> recoveries = new ArrayList<>();
        relativities("claim frequency", "frequency", frequency.coefficients(), true, recoveries);
        relativities("average claim amount", "severity", severity.coefficients(), false, recoveries);
        FittedModel tweedie = purePremium(portfolio, frequency, severity);

        section("6. True simulated parameters beside the estimates");
        truthTable(poisson, severity, nb, recoveries);

        section("7. Files");
        List<Path> files = DemoFiles.write(settings.output(), portfolio, frequency, severity, tweedie, out);

        section("8. Cautions");
        for (String line : CAUTIONS) {
            out.println("  " + line);
        }
        out.println();
        out.printf(Locale.ROOT, "demo finished in %.1f s%n", (System.nanoTime() - started) / 1e9);
        out.flush();
        return new DemoResult(portfolio, poisson, nb, gammaLog, dispersions, sevAge, freqRegion, tweedie,
                tweedieProfilePower, recoveries, files);
    }

    private void introduce(MotorPortfolio portfolio) {
        Table t = portfolio.policies();
        double exposure = sum(t.numeric(EXPOSURE));
        double claims = sum(t.numeric(CLAIMS));
        double total = sum(t.numeric(CLAIM_TOTAL));
        out.println("Reweigh demo: a synthetic motor portfolio fitted end to end");
        out.printf(Locale.ROOT, "  %,d policies, %,.1f policy-years, %,.0f claims (%.4f per policy-year), "
                        + "%,d policies with claims%n", t.rowCount(), exposure, claims, claims / exposure,
                portfolio.policiesWithClaims().rowCount());
        out.printf(Locale.ROOT, "  claim total %,.0f, average claim %,.0f, loss cost %,.1f per policy-year%n",
                total, total / claims, total / exposure);
        out.println("  rating factors: driver age band (5 levels), vehicle power group (5), region (12);"
                + " annual mileage in thousands of km");
        out.printf(Locale.ROOT, "  simulated with seed %d from known models: Poisson claim counts and Gamma claim "
                + "amounts (shape %.2f), both with log links%n", portfolio.seed(), truth.severityShape());
        out.flush();
    }

    private NegativeBinomialTheta frequencyModels(FittedModel poisson, Inference frequency) {
        out.printf(Locale.ROOT, "  Poisson, log link, offset log(exposure): %s after %d iterations; deviance %s on %d"
                        + " residual df%n", poisson.converged() ? "converged" : "NOT converged", poisson.iterations(),
                num(poisson.deviance()), poisson.residualDf());
        double pearsonRatio = frequency.goodnessOfFit().pearsonChiSquare() / poisson.residualDf();
        out.printf(Locale.ROOT, "  Pearson chi-square / residual df = %s (near 1: no sign of overdispersion)%n",
                fixed(pearsonRatio, 4));
        warnings(poisson.warnings());
        NegativeBinomialTheta nb = NegativeBinomialTheta.estimate(poisson);
        out.printf(Locale.ROOT, "  negative binomial (variance mu + mu^2/theta): theta %s (s.e. %s) after %d rounds%n",
                num(nb.theta()), num(nb.standardError()), nb.rounds());
        warnings(nb.warnings());
        InformationCriteria p = frequency.informationCriteria();
        InformationCriteria n = nb.informationCriteria();
        TextGrid grid = new TextGrid("model", "log-likelihood", "parameters", "AIC", "BIC");
        grid.row("Poisson", fixed(p.logLikelihood(), 1), Integer.toString(p.parameters()), fixed(p.aic(), 1),
                fixed(p.bic(), 1));
        grid.row("negative binomial", fixed(n.logLikelihood(), 1), Integer.toString(n.parameters()),
                fixed(n.aic(), 1), fixed(n.bic(), 1));
        out.print(grid.render("  "));
        out.printf(Locale.ROOT, "  lower AIC: %s (theta is a parameter of the negative binomial model)%n",
                p.aic() <= n.aic() ? "Poisson" : "negative binomial");
        out.flush();
        return nb;
    }

    private void severityModels(FittedModel gammaLog) {
        Map<String, FittedModel> candidates = new LinkedHashMap<>();
        candidates.put("Gamma, log link", gammaLog);
        ModelSpec spec = gammaLog.spec();
        tryFit(candidates, "Gamma, identity link", gammaLog, spec.withLink(Links.identity()));
        tryFit(candidates, "Gaussian, log link", gammaLog, spec.withFamily(Families.gaussian()));
        tryFit(candidates, "inverse Gaussian, log link", gammaLog, spec.withFamily(Families.inverseGaussian()));
        ModelComparison comparison = ModelComparison.ofLabelled(Criterion.AIC, candidates);
        TextGrid grid = new TextGrid("model (best first)", "deviance", "log-likelihood", "parameters", "AIC", "BIC",
                "AIC weight");
        for (ComparedModel m : comparison.models()) {
            InformationCriteria ic = m.criteria();
            grid.row(m.label(), num(m.fit().deviance()), fixed(ic.logLikelihood(), 1),
                    Integer.toString(ic.parameters()), fixed(ic.aic(), 1), fixed(ic.bic(), 1), fixed(m.weight(), 3));
        }
        out.print(grid.render("  "));
        out.println("  deviances are on each family's own scale; across families compare the exact log-likelihoods,");
        out.println("  AIC and BIC (the dispersion counts as a parameter). The simulation used Gamma amounts with a"
                + " log link.");
        for (Map.Entry<String, FittedModel> e : candidates.entrySet()) {
            for (String w : e.getValue().warnings()) {
                out.println("  warning (" + e.getKey() + "): " + w);
            }
        }
        out.flush();
    }

    private void tryFit(Map<String, FittedModel> candidates, String label, FittedModel base, ModelSpec spec) {
        try {
            candidates.put(label, base.refit(spec));
        } catch (ReweighException e) {
            out.println("  " + label + " could not be fitted: " + e.getMessage());
        }
    }

    private List<DispersionEstimate> dispersions(FittedModel gammaLog) {
        List<DispersionEstimate> estimates = List.of(
                DispersionEstimate.of(gammaLog, DispersionMethod.PEARSON),
                DispersionEstimate.of(gammaLog, DispersionMethod.DEVIANCE),
                DispersionEstimate.of(gammaLog, DispersionMethod.MAXIMUM_LIKELIHOOD));
        TextGrid grid = new TextGrid("method", "dispersion", "s.e.", percent() + " range", "Gamma shape (1/dispersion)");
        String[] names = {"Pearson (moment)", "deviance (moment)", "maximum likelihood"};
        for (int i = 0; i < 3; i++) {
            DispersionEstimate d = estimates.get(i);
            Interval range = (i == 2 ? d.likelihoodInterval(LEVEL) : d.chiSquareInterval(LEVEL)).orElse(null);
            grid.row(names[i], fixed(d.value(), 4), d.standardError().isPresent()
                            ? fixed(d.standardError().getAsDouble(), 4) : "-",
                    range == null ? "-" : fixed(range.lower(), 4) + " to " + fixed(range.upper(), 4),
                    fixed(1 / d.value(), 3));
        }
        grid.row("true value", fixed(truth.severityDispersion(), 4), "", "", fixed(truth.severityShape(), 3));
        out.print(grid.render("  "));
        out.println("  Pearson and maximum likelihood estimate phi consistently; the deviance estimate runs high when");
        out.println("  the Gamma shape is small, as here. Ranges: chi-square for the moment estimates, likelihood"
                + " for ML.");
        out.flush();
        return estimates;
    }

    private void levelSummary(Inference severity) {
        out.println("  average claim by vehicle power group: observed, and implied by the Gamma model"
                + " (maximum-likelihood dispersion)");
        TextGrid grid = new TextGrid("power group", "policies", "observed mean", "model mean", "observed s.d.",
                "model s.d.");
        for (LevelSummary s : severity.groupSummary(POWER).levels()) {
            grid.row(s.level(), Integer.toString(s.rows()), fixed(s.observedMean(), 0), fixed(s.fittedMean(), 0),
                    fixed(s.observedStandardDeviation(), 0), fixed(s.fittedStandardDeviation(), 0));
        }
        out.print(grid.render("  "));
        out.flush();
    }

    private void describeTest(String what, LikelihoodRatioTest t, String truthNote) {
        String stat = t.reference() == ReferenceDistribution.F
                ? String.format(Locale.ROOT, "F = %s on %d and %d df", fixed(t.statistic(), 3), t.dfDifference(),
                t.denominatorDf())
                : String.format(Locale.ROOT, "chi-square = %s on %d df", fixed(t.statistic(), 2), t.dfDifference());
        out.printf(Locale.ROOT, "  %s: deviance rises by %s; %s; p-value %s%n", what, num(t.devianceDifference()), stat,
                TextGrid.p(t.pValue()));
        out.printf(Locale.ROOT, "    %s: %s%n", t.pValue() < 0.05 ? "keep the factor" : "no evidence the factor is"
                + " needed", truthNote);
        out.flush();
    }

    private void relativities(String title, String model, CoefficientTable table, boolean frequency,
                              List<Recovery> recoveries) {
        out.println("  " + title + ":");
        TextGrid grid = new TextGrid("column", "relativity", percent() + " range", "true", "error in s.e.");
        for (CoefficientRow row : table.rows()) {
            if (row.isAliased()) {
                grid.row(row.name(), "aliased", "", "", "");
                continue;
            }
            double trueBeta = (frequency ? truth.frequencyCoefficient(row.name())
                    : truth.severityCoefficient(row.name())).orElse(Double.NaN);
            Interval r = row.relativityInterval().orElseThrow();
            Recovery rec = new Recovery(model, row.name(), row.estimate(), row.standardError(), trueBeta);
            recoveries.add(rec);
            String shown = row.name().equals("intercept") ? "intercept (base " + (frequency ? "frequency" : "claim")
                    + ")" : row.name();
            grid.row(shown, num(row.relativity().orElseThrow()), num(r.lower()) + " to " + num(r.upper()),
                    num(Math.exp(trueBeta)), fixed(rec.standardizedError(), 2));
        }
        out.print(grid.render("  "));
        out.println("  (base levels have relativity 1: driver age " + truth.baseLevel(DRIVER_AGE) + ", power "
                + truth.baseLevel(POWER) + ", region " + truth.baseLevel(REGION)
                + (frequency ? "; mileage_k is the relativity per 1000 km)" : ")"));
        out.flush();
    }

    private FittedModel purePremium(MotorPortfolio portfolio, Inference frequency, Inference severity) {
        Table examples = Table.builder()
                .categorical(DRIVER_AGE, truth.levels(DRIVER_AGE), "18-24", "35-49", "50-64", "65+")
                .categorical(POWER, truth.levels(POWER), "G5", "G3", "G2", "G4")
                .categorical(REGION, truth.levels(REGION), "metro-south", "metro-central", "highlands", "islands")
                .numeric(MILEAGE, 22, 12, 7, 15)
                .numeric(EXPOSURE, 1, 1, 1, 1)
                .build();
        // A Poisson number of Gamma(k) amounts is a Tweedie variable with power p = (k + 2) / (k + 1) (common
        // practice, no source); k comes from the severity fit, which is far cheaper than profiling p by refits.
        double shape = 1 / severity.dispersion().value();
        double tweediePower = (shape + 2) / (shape + 1);
        FittedModel tweedie = Glm.fit(tweedieSpec(truth, tweediePower), portfolio.policies());
        Inference tw = Inference.of(tweedie);
        PredictionTable f = frequency.predict(examples);
        PredictionTable s = severity.predict(examples);
        PredictionTable t = tw.predict(examples);
        double z = 1.959963984540054; // normal 97.5% point, common practice, no source
        out.println();
        out.println("  pure premium per policy-year of four example policies: frequency x severity, with an"
                + " interval");
        out.println("  from both models' standard errors (independent, as the likelihood factorises), beside a"
                + " Tweedie model");
        TextGrid grid = new TextGrid("policy", "frequency", "severity", "pure premium", percent() + " range", "true",
                "Tweedie", "Tweedie range");
        for (int i = 0; i < examples.rowCount(); i++) {
            Prediction pf = f.predictions().get(i);
            Prediction ps = s.predictions().get(i);
            Prediction pt = t.predictions().get(i);
            double pp = pf.mean() * ps.mean();
            double se = Math.hypot(pf.linkStandardError(), ps.linkStandardError());
            String age = examples.value(DRIVER_AGE, i);
            String power = examples.value(POWER, i);
            String region = examples.value(REGION, i);
            double mileage = examples.numeric(MILEAGE)[i];
            double truePp = truth.frequency(age, power, region, mileage) * truth.severity(age, power, region);
            grid.row(age + "/" + power + "/" + region + "/" + (int) mileage + "k", fixed(pf.mean(), 4),
                    fixed(ps.mean(), 0), fixed(pp, 1), fixed(pp * Math.exp(-z * se), 1) + " to "
                            + fixed(pp * Math.exp(z * se), 1), fixed(truePp, 1), fixed(pt.mean(), 1),
                    fixed(pt.interval().lower(), 1) + " to " + fixed(pt.interval().upper(), 1));
        }
        out.print(grid.render("  "));
        out.printf(Locale.ROOT, "  Tweedie power %s, from the estimated claim-amount shape k = %s as p = (k + 2) / (k + 1)"
                        + " (true %s); %s after %d iterations%n", fixed(tweediePower, 3), fixed(shape, 3),
                fixed((truth.severityShape() + 2) / (truth.severityShape() + 1), 3),
                tweedie.converged() ? "converged" : "NOT converged", tweedie.iterations());
        // the shortcut checked against the power's own profile likelihood (a refit and a maximum-likelihood
        // dispersion per power; a few seconds on this portfolio)
        TweediePowerProfile profile = TweediePowerProfile.of(tweedie, 1.1, 1.9, 5);
        tweedieProfilePower = profile.power();
        out.printf(Locale.ROOT, "  check: the profile likelihood of the power over [1.1, 1.9] peaks at p = %s%n",
                fixed(profile.power(), 3));
        out.println("  vehicle power relativities: frequency x severity against the one Tweedie model");
        TextGrid rel = new TextGrid("power group", "freq x sev", "Tweedie", "true");
        CoefficientTable fc = frequency.coefficients();
        CoefficientTable sc = severity.coefficients();
        CoefficientTable tc = tw.coefficients();
        for (String level : truth.levels(POWER)) {
            String col = POWER + "=" + level;
            boolean base = level.equals(truth.baseLevel(POWER));
            double product = base ? 1 : fc.row(col).relativity().orElseThrow() * sc.row(col).relativity().orElseThrow();
            double tweedieRel = base ? 1 : tc.row(col).relativity().orElseThrow();
            rel.row(level + (base ? " (base)" : ""), fixed(product, 3), fixed(tweedieRel, 3),
                    fixed(truth.frequencyRelativity(POWER, level) * truth.severityRelativity(POWER, level), 3));
        }
        out.print(rel.render("  "));
        warnings(tweedie.warnings());
        out.flush();
        return tweedie;
    }

    private void truthTable(FittedModel poisson, Inference severity, NegativeBinomialTheta nb,
                            List<Recovery> recoveries) {
        TextGrid grid = new TextGrid("parameter", "estimate", percent() + " range", "true");
        CoefficientRow intercept = Inference.of(poisson).coefficients().row("intercept");
        Interval ir = intercept.relativityInterval().orElseThrow();
        grid.row("base claim frequency (per policy-year, zero mileage)", fixed(intercept.relativity().orElseThrow(), 4),
                fixed(ir.lower(), 4) + " to " + fixed(ir.upper(), 4), fixed(truth.frequencyBase(), 4));
        CoefficientRow mileage = Inference.of(poisson).coefficients().row(MILEAGE);
        Interval mr = mileage.waldInterval().orElseThrow();
        grid.row("log-frequency change per 1000 km", fixed(mileage.estimate(), 4),
                fixed(mr.lower(), 4) + " to " + fixed(mr.upper(), 4), fixed(truth.mileageSlope(), 4));
        CoefficientRow sevIntercept = severity.coefficients().row("intercept");
        Interval sr = sevIntercept.relativityInterval().orElseThrow();
        grid.row("base mean claim amount", fixed(sevIntercept.relativity().orElseThrow(), 0),
                fixed(sr.lower(), 0) + " to " + fixed(sr.upper(), 0), fixed(truth.severityBase(), 0));
        DispersionEstimate ml = severity.dispersion();
        Interval dr = ml.likelihoodInterval(LEVEL).orElse(null);
        grid.row("Gamma shape of one claim (1 / ML dispersion)", fixed(1 / ml.value(), 3),
                dr == null ? "-" : fixed(1 / dr.upper(), 3) + " to " + fixed(1 / dr.lower(), 3),
                fixed(truth.severityShape(), 3));
        grid.row("negative binomial theta", num(nb.theta()), "", "infinite (Poisson counts)");
        out.print(grid.render("  "));
        int within2 = 0;
        double worst = 0;
        String worstName = "";
        for (Recovery r : recoveries) {
            double e = Math.abs(r.standardizedError());
            within2 += e <= 2 ? 1 : 0;
            if (e > worst) {
                worst = e;
                worstName = r.model() + " " + r.column();
            }
        }
        out.printf(Locale.ROOT, "  %d of %d coefficients lie within 2 standard errors of the truth (about 95%% should);"
                + " largest miss %.2f s.e. (%s)%n", within2, recoveries.size(), worst, worstName);
        out.flush();
    }

    private void warnings(List<String> warnings) {
        for (String w : warnings) {
            out.println("  warning: " + w);
        }
    }

    private long lastSection = System.nanoTime();

    private void section(String title) {
        long now = System.nanoTime();
        double seconds = (now - lastSection) / 1e9;
        lastSection = now;
        LOG.log(System.Logger.Level.DEBUG, () -> String.format(Locale.ROOT, "%.2f s before section '%s'", seconds,
                title));
        out.println();
        out.println("== " + title);
        out.flush();
    }

    private static String percent() {
        return String.format(Locale.ROOT, "%.0f%%", 100 * LEVEL);
    }

    private static double sum(double[] v) {
        double s = 0;
        for (double x : v) {
            s += x;
        }
        return s;
    }
}
