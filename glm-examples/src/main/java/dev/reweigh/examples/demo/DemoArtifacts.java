package dev.reweigh.examples.demo;

import dev.reweigh.core.FittedModel;
import dev.reweigh.core.ModelArtifact;
import dev.reweigh.examples.ModelFiles;
import dev.reweigh.inference.DispersionEstimate;
import dev.reweigh.inference.DispersionMethod;

import java.nio.file.Path;
import java.util.List;

/**
 * Writes the demo's fitted models as artifacts (the library's own JSON schema), each scorable
 * with {@code reweigh score --model FILE}.
 */
final class DemoArtifacts {
    static final String FREQUENCY = "frequency-model.json";
    static final String SEVERITY = "severity-model.json";
    static final String PURE_PREMIUM = "pure-premium-model.json";

    private DemoArtifacts() {
    }

    static List<Path> write(Path folder, FittedModel frequency, FittedModel severity, FittedModel tweedie) {
        Path f = folder.resolve(FREQUENCY);
        ModelFiles.save(ModelArtifact.of(frequency), f);
        Path s = folder.resolve(SEVERITY);
        double ml = DispersionEstimate.of(severity, DispersionMethod.MAXIMUM_LIKELIHOOD).value();
        ModelFiles.save(ModelArtifact.of(severity, ml, "maximum likelihood"), s);
        Path t = folder.resolve(PURE_PREMIUM);
        ModelFiles.save(ModelArtifact.of(tweedie), t);
        return List.of(f, s, t);
    }
}
