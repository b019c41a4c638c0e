package dev.reweigh.core.internal;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.junit.jupiter.api.Test;

/** Numbers in error messages: shortest digits that read back to the same double. */
class NumberTextTest {

    @Test
    void wholeNumbersHaveNoFractionalPart() {
        assertEquals("-1", NumberText.of(-1.0));
        assertEquals("0", NumberText.of(0.0));
        assertEquals("-0", NumberText.of(-0.0));
        assertEquals("3", NumberText.of(3.0));
        assertEquals("1234567", NumberText.of(1234567.0));
        assertEquals("1E7", NumberText.of(1e7));
        assertEquals("-2.5E9", NumberText.of(-2.5e9));
    }

    @Test
    void fractionsAndSmallOrLargeMagnitudes() {
        assertEquals("0.1", NumberText.of(0.1));
        assertEquals("-0.25", NumberText.of(-0.25));
        assertEquals("0.001", NumberText.of(0.001));
        assertEquals("1E-5", NumberText.of(1e-5));
        assertEquals("1.5E-7", NumberText.of(1.5e-7));
        assertEquals("5E-324", NumberText.of(Double.MIN_VALUE)); // Double.toString: "4.9E-324"
        assertEquals("1.7976931348623157E308", NumberText.of(Double.MAX_VALUE));
        // Java 17's Double.toString gives "2.82879384806159008E17" and "9.999999999999999E22" for
        // these two (seen on OpenJDK 17.0.15); the shortest texts read back as well
        assertEquals("2.82879384806159E17", NumberText.of(2.82879384806159E17));
        assertEquals("1E23", NumberText.of(1e23));
    }

    @Test
    void nonFiniteValuesStayReadable() {
        assertEquals("NaN", NumberText.of(Double.NaN));
        assertEquals("Infinity", NumberText.of(Double.POSITIVE_INFINITY));
        assertEquals("-Infinity", NumberText.of(Double.NEGATIVE_INFINITY));
    }

    @Provide
    Arbitrary<Double> anyFiniteDouble() {
        return Arbitraries.oneOf(
                Arbitraries.longs().map(Double::longBitsToDouble).filter(Double::isFinite),
                Arbitraries.integers().between(-100000, 100000).map(i -> i / 8.0),
                Arbitraries.doubles().between(-1e9, 1e9).ofScale(3));
    }

    @Property(tries = 500)
    void readsBackToTheSameDoubleWithNoDigitToSpare(@ForAll("anyFiniteDouble") double x) {
        String text = NumberText.of(x);
        assertEquals(Double.doubleToRawLongBits(x), Double.doubleToRawLongBits(Double.parseDouble(text)), text);
        assertFalse(text.endsWith(".0") || text.contains(".0E"), text);
        if (x == Math.rint(x) && Math.abs(x) < 1e7) {
            assertFalse(text.contains(".") || text.contains("E"), text);
        }
        // no shorter rounding of the exact value reads back (independent of the formatter's path)
        BigDecimal digits = new BigDecimal(text).stripTrailingZeros();
        int precision = digits.precision();
        assertTrue(precision <= 17, text);
        if (x != 0 && precision > 1) {
            BigDecimal shorter = new BigDecimal(x).round(new MathContext(precision - 1, RoundingMode.HALF_EVEN));
            assertNotEquals(x, shorter.doubleValue(), text + " has a digit to spare");
        }
    }
}
