package dev.reweigh.core.artifact;

import dev.reweigh.core.FittedModel;
import dev.reweigh.core.Glm;
import dev.reweigh.core.ModelArtifact;
import dev.reweigh.core.ModelSpec;
import dev.reweigh.core.Table;
import dev.reweigh.families.Families;

/** One claim-frequency model of the synthetic portfolio, fitted once, and its artifact. */
final class Fixtures {
    static final Portfolio TRAIN = new Portfolio(500, 3);
    static final Table TRAIN_TABLE = TRAIN.table("claims", TRAIN.response("poisson", true));
    static final ModelSpec SPEC = ModelSpec.builder("claims").family(Families.poisson())
            .factor("region")
            .factor("vehicle")
            .polynomial("age", 2, true)
            .interaction("vehicle", "value")
            .logOffset("exposure")
            .build();
    static final FittedModel FIT = Glm.fit(SPEC, TRAIN_TABLE);
    static final ModelArtifact ARTIFACT = ModelArtifact.of(FIT);
    static final String JSON = ARTIFACT.toJson();
    static final Portfolio FRESH = new Portfolio(2000, 77);
    static final Table FRESH_TABLE = FRESH.table("claims", null);

    private Fixtures() {
    }
}
