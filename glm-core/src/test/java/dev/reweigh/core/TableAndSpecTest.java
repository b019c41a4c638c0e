package dev.reweigh.core;

import dev.reweigh.families.Families;
import dev.reweigh.families.InvalidDataException;
import dev.reweigh.families.Links;
import dev.reweigh.families.ReweighException;
import dev.reweigh.families.UnknownNameException;
import org.junit.jupiter.api.Test;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class TableAndSpecTest {

    @Test
    void levelsInNaturalOrderUnlessGiven() {
        Table t = Table.builder().categorical("band", "10", "2", "1", "b", "a", "2").build();
        assertEquals(List.of("1", "2", "10", "a", "b"), t.levels("band"));
        assertArrayEquals(new int[] {2, 1, 0, 4, 3, 1}, t.codes("band"));
        Table g = Table.builder().categorical("band", List.of("b", "a"), "a", "b", null).build();
        assertEquals(List.of("b", "a"), g.levels("band"));
        assertArrayEquals(new int[] {1, 0, -1}, g.codes("band"));
        assertEquals("NA", g.value("band", 2));
        assertThrows(UnknownNameException.class, () -> Table.builder().categorical("band", List.of("a"), "a", "c"));
    }

    @Test
    void tablesCheckLengthsNamesAndKinds() {
        InvalidDataException e = assertThrows(InvalidDataException.class,
                () -> Table.builder().numeric("a", 1, 2).numeric("b", 1).build());
        assertEquals("b", e.column());
        assertTrue(e.getMessage().contains("a=2") && e.getMessage().contains("b=1"));
        assertThrows(ReweighException.class, () -> Table.builder().numeric("a", 1).numeric("a", 2));
        assertThrows(ReweighException.class, () -> Table.builder().build());
        Table t = Table.builder().numeric("a", 1, 2, 3).categorical("c", "x", "y", "x").build();
        UnknownNameException u = assertThrows(UnknownNameException.class, () -> t.numeric("z"));
        assertEquals(List.of("a", "c"), u.validNames());
        assertTrue(t.isNumeric("a") && t.isCategorical("c") && !t.hasColumn("z"));
        assertThrows(ReweighException.class, () -> t.levels("a"));
        double[] copy = t.numeric("a");
        copy[0] = 99;
        assertEquals(1.0, t.numeric("a")[0]);
        Table s = t.select(new int[] {2, 0, 0});
        assertArrayEquals(new double[] {3, 1, 1}, s.numeric("a"));
        assertEquals(List.of("x", "y"), s.levels("c"));
        assertTrue(t.toString().contains("3 rows"));
    }

    @Test
    void specificationDefaultsAndVariations() {
        ModelSpec s = ModelSpec.builder("y").numeric("a").factor("c").build();
        assertEquals("gaussian", s.family().name());
        assertEquals("identity", s.link().name());
        assertTrue(s.hasIntercept());
        ModelSpec p = s.withFamily(Families.poisson());
        assertEquals("log", p.link().name());
        ModelSpec chosen = s.withLink(Links.log()).withFamily(Families.gamma());
        assertEquals("log", chosen.link().name());
        assertEquals(List.of("c"), s.withoutTerm("a").terms().stream().map(Term::label).collect(java.util.stream.Collectors.toList()));
        assertThrows(UnknownNameException.class, () -> s.withoutTerm("b"));
        assertEquals("region & age", Term.interaction(Term.factor("region"), Term.numeric("age")).label());
        assertEquals("age^1..3", Term.polynomial("age", 3, false).label());
        assertEquals("age[1..2]", Term.polynomial("age", 2, true).label());
        assertEquals(Term.factor("a", "x"), Term.factor("a", "x"));
        assertFalse(Term.factor("a", "x").equals(Term.factor("a")));
        assertEquals(List.of("y", "a", "c"), s.usedColumns());
    }

    @Test
    void columnNamesOfEveryKindOfTerm() {
        Table t = Table.builder()
                .numeric("y", 1, 2, 3, 4, 5, 6, 7, 8, 9, 10)
                .numeric("age", 20, 30, 40, 50, 60, 25, 35, 45, 55, 65)
                .numeric("power", 1, 2, 1, 2, 1, 3, 2, 1, 2, 3)
                .categorical("region", "N", "S", "N", "S", "E", "N", "S", "E", "N", "N")
                .categorical("fuel", "d", "p", "p", "d", "p", "d", "p", "d", "p", "p")
                .build();
        ModelSpec spec = ModelSpec.builder("y").factor("region").interaction("region", "age")
                .interaction("age", "power").term(Term.interaction(Term.factor("region"), Term.factor("fuel", "d")))
                .polynomial("age", 2, true).intercept(false).build();
        FittedModel fit = Glm.fit(spec, t);
        // no intercept: the first factor has a column for every level; inside the interactions
        // region keeps its reference N (most rows)
        assertEquals(List.of("region=E", "region=N", "region=S", "region=E & age", "region=S & age", "age & power",
                "region=E & fuel=p", "region=S & fuel=p", "age[1]", "age[2]"), fit.columnNames());
        double[] row = new double[fit.columnCount()];
        fit.modelMatrixRow(1, row); // S, age 30, power 2, fuel p
        assertEquals(0.0, row[0]);
        assertEquals(0.0, row[1]);
        assertEquals(1.0, row[2]);
        assertEquals(30.0, row[4]);
        assertEquals(60.0, row[5]);
        assertEquals(1.0, row[7]);
        assertEquals(0.0, row[6]);
    }
}
