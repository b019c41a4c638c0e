package dev.reweigh.examples.demo;

import dev.reweigh.core.FittedModel;
import dev.reweigh.inference.DispersionEstimate;
import dev.reweigh.inference.LikelihoodRatioTest;
import dev.reweigh.inference.NegativeBinomialTheta;

import java.nio.file.Path;
import java.util.List;

/**
 * What one run of the demo produced: the portfolio, the main fits, the estimates beside the truth
 * and the files written.
 *
 * @since 0.1
 */
public final class DemoResult {
    private final MotorPortfolio portfolio;
    private final FittedModel frequency;
    private final NegativeBinomialTheta negativeBinomial;
    private final FittedModel severity;
    private final List<DispersionEstimate> severityDispersions;
    private final LikelihoodRatioTest severityWithoutAge;
    private final LikelihoodRatioTest frequencyWithoutRegion;
    private final FittedModel tweedie;
    private final double tweedieProfilePower;
    private final List<Recovery> recoveries;
    private final List<Path> files;

    DemoResult(MotorPortfolio portfolio, FittedModel frequency, NegativeBinomialTheta negativeBinomial,
               FittedModel severity, List<DispersionEstimate> severityDispersions,
               LikelihoodRatioTest severityWithoutAge, LikelihoodRatioTest frequencyWithoutRegion,
               FittedModel tweedie, double tweedieProfilePower, List<Recovery> recoveries, List<Path> files) {
        this.portfolio = portfolio;
        this.frequency = frequency;
        this.negativeBinomial = negativeBinomial;
        this.severity = severity;
        this.severityDispersions = List.copyOf(severityDispersions);
        this.severityWithoutAge = severityWithoutAge;
        this.frequencyWithoutRegion = frequencyWithoutRegion;
        this.tweedie = tweedie;
        this.tweedieProfilePower = tweedieProfilePower;
        this.recoveries = List.copyOf(recoveries);
        this.files = List.copyOf(files);
    }

    /**
     * Returns the simulated portfolio.
     *
     * @return the portfolio
     * @since 0.1
     */
    public MotorPortfolio portfolio() {
        return portfolio;
    }

    /**
     * Returns the Poisson frequency fit.
     *
     * @return the fit
     * @since 0.1
     */
    public FittedModel frequency() {
        return frequency;
    }

    /**
     * Returns the negative binomial frequency model with its theta.
     *
     * @return the estimate
     * @since 0.1
     */
    public NegativeBinomialTheta negativeBinomial() {
        return negativeBinomial;
    }

    /**
     * Returns the Gamma (log link) severity fit.
     *
     * @return the fit
     * @since 0.1
     */
    public FittedModel severity() {
        return severity;
    }

    /**
     * Returns the severity dispersion by the Pearson, deviance and maximum-likelihood methods.
     *
     * @return three estimates in that order
     * @since 0.1
     */
    public List<DispersionEstimate> severityDispersions() {
        return severityDispersions;
    }

    /**
     * Returns the likelihood-ratio test of dropping driver age from the severity model.
     *
     * @return the test
     * @since 0.1
     */
    public LikelihoodRatioTest severityWithoutAge() {
        return severityWithoutAge;
    }

    /**
     * Returns the likelihood-ratio test of dropping region from the frequency model.
     *
     * @return the test
     * @since 0.1
     */
    public LikelihoodRatioTest frequencyWithoutRegion() {
        return frequencyWithoutRegion;
    }

    /**
     * Returns the Tweedie pure-premium fit.
     *
     * @return the fit
     * @since 0.1
     */
    public FittedModel tweedie() {
        return tweedie;
    }

    /**
     * Returns the Tweedie power at the maximum of its profile likelihood, the check on the power
     * the pure-premium model takes from the severity shape.
     *
     * @return the power
     * @since 0.1
     */
    public double tweedieProfilePower() {
        return tweedieProfilePower;
    }

    /**
     * Returns every frequency and severity coefficient beside its true value.
     *
     * @return the rows
     * @since 0.1
     */
    public List<Recovery> recoveries() {
        return recoveries;
    }

    /**
     * Returns the files written to the output folder.
     *
     * @return the paths
     * @since 0.1
     */
    public List<Path> files() {
        return files;
    }
}
