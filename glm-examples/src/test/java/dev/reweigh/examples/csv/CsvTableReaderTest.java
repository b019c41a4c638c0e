package dev.reweigh.examples.csv;

import dev.reweigh.core.Table;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.StringReader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Column typing, missing values and error reports of the CSV reader. */
class CsvTableReaderTest {
    private static Table read(String text) {
        return CsvTableReader.builder().build().read(new StringReader(text), "test.csv");
    }

    @Test
    void columnsOfNumbersAreNumericOthersCategorical() {
        Table t = read("claims,exposure,region,band\n0,1.0,north,2\n2,0.5,south,10\n1,.25,north,2\n");
        assertTrue(t.isNumeric("claims"));
        assertTrue(t.isNumeric("exposure"));
        assertTrue(t.isCategorical("region"));
        assertTrue(t.isNumeric("band"));
        assertEquals(0.25, t.numeric("exposure")[2]);
        assertEquals(List.of("north", "south"), t.levels("region"));
    }

    @Test
    void aFactorColumnOfNumbersKeepsNaturalLevelOrder() {
        Table t = CsvTableReader.builder().factor("band").build()
                .read(new StringReader("band,y\n2,1\n10,2\n1,3\n"), "test.csv");
        assertTrue(t.isCategorical("band"));
        assertEquals(List.of("1", "2", "10"), t.levels("band"));
    }

    @Test
    void emptyCellsAreMissing() {
        Table t = read("x,g\n1,a\n,\n3,b\n");
        assertTrue(Double.isNaN(t.numeric("x")[1]));
        assertEquals(-1, t.codes("g")[1]);
        assertEquals(3, t.rowCount());
    }

    @Test
    void surroundingSpacesAndQuotesAreRemoved() {
        Table t = read("x, g\n 1 ,\" a, b \"\n");
        assertEquals(1.0, t.numeric("x")[0]);
        assertEquals(List.of("a, b"), t.levels("g"));
    }

    @Test
    void textInADeclaredNumericColumnNamesFileColumnRowAndValue() {
        CellException e = assertThrows(CellException.class, () -> CsvTableReader.builder().numeric("x").build()
                .read(new StringReader("x\n1\n2\nthree\n"), "policies.csv"));
        assertEquals("x", e.column());
        assertEquals(2, e.row(), "0-based table row");
        assertEquals(3, e.dataRow(), "1-based data row");
        assertEquals("three", e.value());
        assertEquals("policies.csv", e.file());
        assertTrue(e.getMessage().contains("file 'policies.csv', column 'x', data row 3 (1 = first row after the"
                + " header)"), e.getMessage());
        assertTrue(e.getMessage().contains("\"three\""), e.getMessage());
    }

    @Test
    void notANumberAndInfinityAreRefusedInNumericColumns() {
        CellException nan = assertThrows(CellException.class, () -> read("x\n1\nNaN\n"));
        assertEquals(1, nan.row());
        CellException inf = assertThrows(CellException.class, () -> read("x\n-inf\n1\n"));
        assertEquals(0, inf.row());
        assertEquals("-inf", inf.value());
    }

    @Test
    void missingFileAndMissingColumnAreFileErrors(@TempDir Path dir) throws IOException {
        DataFileException missing = assertThrows(DataFileException.class,
                () -> CsvTableReader.builder().build().read(dir.resolve("none.csv")));
        assertTrue(missing.getMessage().contains("none.csv") && missing.getMessage().contains("no such file"));
        Path f = Files.writeString(dir.resolve("a.csv"), "x,y\n1,2\n");
        DataFileException column = assertThrows(DataFileException.class,
                () -> CsvTableReader.builder().numeric("z").build().read(f));
        assertTrue(column.getMessage().contains("'z'") && column.getMessage().contains("x, y"), column.getMessage());
    }

    @Test
    void raggedRecordsAndBadHeadersAreFileErrors() {
        DataFileException ragged = assertThrows(DataFileException.class, () -> read("x,y\n1,2\n3\n"));
        assertTrue(ragged.getMessage().contains("data row 2"), ragged.getMessage());
        assertThrows(DataFileException.class, () -> read("x,x\n1,2\n"));
        assertThrows(DataFileException.class, () -> read(",y\n1,2\n"));
        assertThrows(DataFileException.class, () -> read(""));
        assertThrows(DataFileException.class, () -> read("x,y\n\"1,2\n"));
    }

    @Test
    void aFileKeepsItsTextForEchoing(@TempDir Path dir) throws IOException {
        Path f = Files.writeString(dir.resolve("b.csv"), "x,g\n1.50,a\n,b\n");
        CsvFile file = CsvTableReader.builder().build().readFile(f);
        assertEquals(List.of("x", "g"), file.header());
        assertEquals(List.of("1.50", "a"), file.row(0));
        assertEquals(List.of("", "b"), file.row(1));
        assertEquals("b", file.table().value("g", 1));
        assertTrue(Double.isNaN(file.table().numeric("x")[1]));
    }
}
