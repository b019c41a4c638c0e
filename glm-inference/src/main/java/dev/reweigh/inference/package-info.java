/**
 * Inference on fitted models: dispersion, coefficient tables, tests, residuals and comparison.
 *
 * <p>{@link dev.reweigh.inference.Inference} is the entry point. It wraps a
 * {@link dev.reweigh.core.FittedModel} with a dispersion (fixed at 1 where the family fixes it,
 * the Pearson estimate otherwise, or any {@link dev.reweigh.inference.DispersionMethod}) and a
 * confidence level, and computes immutable result objects whose {@code toString} is a readable
 * plain-text table:
 *
 * <pre>{@code
 * FittedModel fit = Glm.fit(spec, table);
 * Inference inference = Inference.of(fit);
 * System.out.println(inference);                                  // coefficients and fit summary
 * CoefficientTable withProfiles = inference.coefficientsWithProfileIntervals();
 * LikelihoodRatioTest test = inference.likelihoodRatioTest(fit.refit(spec.withoutTerm("region")));
 * DevianceTable sequential = inference.devianceTable();
 * double[] cooks = inference.diagnostics().cooksDistance();
 * double[] quantileResiduals = inference.residuals().withSeed(7).randomizedQuantile();
 * ModelComparison ranking = ModelComparison.of(Criterion.AIC, gammaFit, inverseGaussianFit);
 * NegativeBinomialTheta theta = NegativeBinomialTheta.estimate(poissonFit);
 * }</pre>
 *
 * <p>Wald statistics are referred to the normal distribution (joint tests and likelihood-ratio
 * tests to chi-square) when the dispersion is fixed or known, and to t (F) with the residual
 * degrees of freedom when it is estimated. Methods that refit the model (profile intervals, the
 * analysis of deviance, theta and the Tweedie power) say so in their documentation.
 *
 * <p>All types are immutable and thread-safe. Arguments are never null; a null argument throws
 * {@link java.lang.NullPointerException}. Caller mistakes (a confidence level outside (0, 1), a
 * method that does not apply to the family) throw {@link java.lang.IllegalArgumentException};
 * problems with the models or data throw subclasses of
 * {@link dev.reweigh.families.ReweighException} with a message that says what was wrong.
 *
 * @since 0.1
 */
package dev.reweigh.inference;
