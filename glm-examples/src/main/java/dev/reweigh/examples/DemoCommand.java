package dev.reweigh.examples;

import dev.reweigh.examples.demo.DemoSettings;
import dev.reweigh.examples.demo.MotorDemo;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

import java.nio.file.Path;
import java.util.concurrent.Callable;

/**
 * {@code demo}: runs the synthetic motor-portfolio demo end to end.
 *
 * @since 0.1
 */
@Command(name = "demo", mixinStandardHelpOptions = true,
        description = {"Runs the synthetic motor-portfolio demo end to end.",
            "Simulates a portfolio from known models; fits frequency, severity and pure premium; compares families"
                + " and links; tests rating factors; prints estimates beside the truth; writes model artifacts, a"
                + " scored CSV and charts to the output folder."})
public final class DemoCommand implements Callable<Integer> {
    @CommandLine.Spec
    private CommandLine.Model.CommandSpec spec;

    @Option(names = "--out", paramLabel = "DIR", description = "output folder (default: ${DEFAULT-VALUE})",
            defaultValue = DemoSettings.DEFAULT_OUTPUT)
    private Path out;

    @Option(names = "--policies", paramLabel = "N", hidden = true, defaultValue = "100000",
            description = "portfolio size (default: ${DEFAULT-VALUE})")
    private int policies;

    /**
     * Creates the command (picocli instantiates it).
     *
     * @since 0.1
     */
    public DemoCommand() {
    }

    /**
     * Runs the demo.
     *
     * @return the exit status, 0
     * @since 0.1
     */
    @Override
    public Integer call() {
        System.setProperty("java.awt.headless", "true");
        MotorDemo.run(DemoSettings.defaults().withOutput(out).withPolicies(policies), spec.commandLine().getOut());
        return 0;
    }
}
