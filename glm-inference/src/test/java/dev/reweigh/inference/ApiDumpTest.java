package dev.reweigh.inference;

import dev.reweigh.apidump.ApiDump;
import org.junit.jupiter.api.Test;

class ApiDumpTest {
    @Test
    void publicApiMatchesCommittedDump() throws Exception {
        ApiDump.verify();
    }
}
