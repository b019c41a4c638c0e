/**
 * Runnable scenarios and the command-line front end.
 *
 * @since 0.1
 */
module dev.reweigh.examples {
    requires dev.reweigh.inference;
    requires org.apache.commons.csv;
    requires info.picocli;
    requires org.jfree.jfreechart;
    requires com.fasterxml.jackson.core;
    requires java.desktop;
    requires commons.math3;

    exports dev.reweigh.examples;
    exports dev.reweigh.examples.csv;
    exports dev.reweigh.examples.demo;
    opens dev.reweigh.examples to info.picocli;
}
