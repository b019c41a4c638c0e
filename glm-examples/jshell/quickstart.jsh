// Reweigh quick start: the claim frequency of a few motor policies, fitted and read in JShell.
// From the repository root, after `mvn -q -B install -DskipTests`:
//   jshell --class-path glm-examples/target/reweigh.jar glm-examples/jshell/quickstart.jsh
// (Builder chains end their lines with a dot, so that JShell waits for the whole statement.)

import dev.reweigh.core.*;
import dev.reweigh.families.*;
import dev.reweigh.inference.*;

// Twenty-four policies: claims in the period, years on cover, driver age band and region.
Table policies = Table.builder().
    numeric("claims",   2, 1, 0, 3, 1, 1, 0, 2,   0, 1, 0, 0, 1, 0, 0, 1,   0, 0, 1, 0, 0, 0, 1, 0).
    numeric("exposure", 1, 0.6, 0.5, 1, 0.8, 1, 0.4, 1,   1, 1, 0.7, 1, 1, 0.9, 1, 1,   1, 0.5, 1, 1, 0.8, 1, 1, 0.6).
    categorical("driver_age", "18-24", "18-24", "18-24", "18-24", "18-24", "18-24", "18-24", "18-24",
                              "35-64", "35-64", "35-64", "35-64", "35-64", "35-64", "35-64", "35-64",
                              "65+", "65+", "65+", "65+", "65+", "65+", "65+", "65+").
    categorical("region", "city", "rural", "city", "city", "rural", "city", "rural", "city",
                          "city", "rural", "city", "rural", "city", "rural", "city", "rural",
                          "rural", "city", "city", "rural", "city", "rural", "city", "rural").
    build();

// Claim counts: Poisson family, log link, two rating factors, log(exposure) as offset.
ModelSpec frequency = ModelSpec.builder("claims").
    family(Families.poisson()).
    factor("driver_age", "35-64").
    factor("region").
    logOffset("exposure").
    build();

FittedModel fit = Glm.fit(frequency, policies);
Inference inference = Inference.of(fit);
System.out.println(inference);

double young = inference.coefficients().row("driver_age=18-24").relativity().getAsDouble();
System.out.printf("drivers aged 18-24 claim %.2f times as often as drivers aged 35-64%n", young);
/exit
