package dev.reweigh.families;

import static org.junit.jupiter.api.Assertions.assertEquals;
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

/** The shortest round-trip text of the numbers in family and link names. */
class DoubleTextTest {

    @Provide
    Arbitrary<Double> anyFinite() {
        return Arbitraries.oneOf(
                Arbitraries.longs().map(Double::longBitsToDouble).filter(Double::isFinite),
                Arbitraries.integers().between(-100000, 100000).map(i -> i / 1000.0));
    }

    @Property(tries = 3000)
    void textReadsBackToTheSameDoubleWithNoSpareDigit(@ForAll("anyFinite") double x) {
        String text = DoubleText.format(x);
        assertEquals(x, DoubleText.parse(text), 0.0, text);
        assertEquals(Double.doubleToLongBits(x), Double.doubleToLongBits(DoubleText.parse(text)), text);
        // One significant digit fewer must no longer read back to x.
        BigDecimal value = new BigDecimal(text.replace("E", "e"));
        int digits = value.stripTrailingZeros().precision();
        if (digits > 1 && x != 0) {
            BigDecimal shorter = new BigDecimal(x).round(new MathContext(digits - 1, RoundingMode.HALF_EVEN));
            assertNotEquals(x, shorter.doubleValue(), text);
        }
    }

    @Test
    void layout() {
        assertEquals("1.5", DoubleText.format(1.5));
        assertEquals("2.0", DoubleText.format(2.0));
        assertEquals("-0.5", DoubleText.format(-0.5));
        assertEquals("0.1", DoubleText.format(0.1));
        assertEquals("0.001", DoubleText.format(0.001));
        assertEquals("1.0E-5", DoubleText.format(1e-5));
        assertEquals("2.5E7", DoubleText.format(2.5e7));
        assertEquals("0.3333333333333333", DoubleText.format(1.0 / 3));
        // Java 17's Double.toString gives 2.0000000000000004E-3 style extra digits for some values; ours is shortest.
        assertEquals("2.0E23", DoubleText.format(2e23));
        assertEquals("0.0", DoubleText.format(0.0));
    }

    @Test
    void parseAcceptsOnlyPlainDecimals() {
        assertEquals(1.5, DoubleText.parse(" 1.50 "));
        assertEquals(-2e-3, DoubleText.parse("-2E-3"));
        assertEquals(0.5, DoubleText.parse(".5"));
        assertEquals(3.0, DoubleText.parse("3."));
        for (String bad : new String[] {"NaN", "Infinity", "0x1p3", "1d", "1.5f", "", "1,5", "e3", "--1"}) {
            assertTrue(Double.isNaN(DoubleText.parse(bad)), bad);
        }
    }
}
