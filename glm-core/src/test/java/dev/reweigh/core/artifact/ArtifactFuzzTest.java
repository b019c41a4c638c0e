package dev.reweigh.core.artifact;

import dev.reweigh.core.ModelArtifact;
import dev.reweigh.core.Scores;
import dev.reweigh.families.ReweighException;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.Size;

import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;

/**
 * Random bytes and random damage to valid artifacts give only the library's documented
 * exceptions (ReweighException subclasses), promptly: no NullPointerException, no index errors,
 * no running out of memory, no hang.
 */
class ArtifactFuzzTest {
    private static final byte[] VALID = Fixtures.JSON.getBytes(StandardCharsets.UTF_8);
    private static final Duration LIMIT = Duration.ofSeconds(10);

    /** Reads; a document that is accepted must have kept its content (same checksum). */
    private static void readOrRefuse(byte[] bytes) {
        assertTimeoutPreemptively(LIMIT, () -> {
            try {
                ModelArtifact a = ModelArtifact.read(new ByteArrayInputStream(bytes));
                assertEquals(Fixtures.ARTIFACT.checksum(), a.checksum(), "an accepted mutation changed the content");
            } catch (ReweighException expected) {
                // the documented outcome
            }
        });
    }

    @Property(tries = 300)
    void randomBytes(@ForAll @Size(max = 3000) byte[] bytes) {
        assertTimeoutPreemptively(LIMIT, () -> {
            try {
                ModelArtifact.read(new ByteArrayInputStream(bytes));
            } catch (ReweighException expected) {
                // the documented outcome
            }
        });
    }

    @Property(tries = 300)
    void byteFlips(@ForAll long seed) {
        Random r = new Random(seed);
        byte[] b = VALID.clone();
        int flips = 1 + r.nextInt(4);
        for (int k = 0; k < flips; k++) {
            int at = r.nextInt(b.length);
            b[at] ^= (byte) (1 << r.nextInt(8));
        }
        readOrRefuse(b);
    }

    @Property(tries = 200)
    void truncations(@ForAll long seed) {
        Random r = new Random(seed);
        readOrRefuse(Arrays.copyOf(VALID, r.nextInt(VALID.length)));
    }

    @Property(tries = 300)
    void insertionsAndDeletions(@ForAll long seed) {
        Random r = new Random(seed);
        int at = r.nextInt(VALID.length);
        byte[] out;
        if (r.nextBoolean()) {
            byte[] ins = new byte[1 + r.nextInt(8)];
            String alphabet = "{}[]\",:0123456789.eE-+ntrufalse \\";
            for (int i = 0; i < ins.length; i++) {
                ins[i] = r.nextInt(3) == 0 ? (byte) r.nextInt(256) : (byte) alphabet.charAt(r.nextInt(alphabet.length()));
            }
            out = new byte[VALID.length + ins.length];
            System.arraycopy(VALID, 0, out, 0, at);
            System.arraycopy(ins, 0, out, at, ins.length);
            System.arraycopy(VALID, at, out, at + ins.length, VALID.length - at);
        } else {
            int len = Math.min(1 + r.nextInt(20), VALID.length - at);
            out = new byte[VALID.length - len];
            System.arraycopy(VALID, 0, out, 0, at);
            System.arraycopy(VALID, at + len, out, at, VALID.length - at - len);
        }
        readOrRefuse(out);
    }

    /**
     * Structural damage that passes the checksum (the document is signed again): a random member
     * removed or a random value replaced. The reader's field checks must catch it, or the model
     * must still score (or refuse rows) with library exceptions only.
     */
    @Property(tries = 400)
    void signedStructuralDamage(@ForAll long seed) {
        Random r = new Random(seed);
        Map<String, Object> doc = ArtifactText.parse(Fixtures.JSON);
        List<Object[]> slots = new ArrayList<>();
        collect(doc, slots);
        Object[] slot = slots.get(r.nextInt(slots.size()));
        Object replacement = randomValue(r);
        boolean remove = r.nextInt(4) == 0;
        set(slot, replacement, remove);
        String json = ArtifactText.signed(doc);
        assertTimeoutPreemptively(LIMIT, () -> {
            try {
                ModelArtifact a = ModelArtifact.fromJson(json);
                Scores s = a.scorerBuilder().unseenLevelsAtReference(r.nextBoolean()).build()
                        .score(Fixtures.FRESH_TABLE);
                assertEquals(Fixtures.FRESH.rows, s.rowCount());
            } catch (ReweighException expected) {
                // the documented outcome
            }
        });
    }

    @SuppressWarnings("unchecked")
    private static void collect(Object node, List<Object[]> out) {
        if (node instanceof Map) {
            for (Map.Entry<String, Object> e : ((Map<String, Object>) node).entrySet()) {
                out.add(new Object[] {node, e.getKey()});
                collect(e.getValue(), out);
            }
        } else if (node instanceof List) {
            List<Object> l = (List<Object>) node;
            for (int i = 0; i < l.size(); i++) {
                out.add(new Object[] {node, i});
                collect(l.get(i), out);
            }
        }
    }

    @SuppressWarnings("unchecked")
    private static void set(Object[] slot, Object value, boolean remove) {
        if (slot[0] instanceof Map) {
            Map<String, Object> m = (Map<String, Object>) slot[0];
            if (remove) {
                m.remove((String) slot[1]);
            } else {
                m.put((String) slot[1], value);
            }
        } else {
            List<Object> l = (List<Object>) slot[0];
            if (remove) {
                l.remove((int) (Integer) slot[1]);
            } else {
                l.set((Integer) slot[1], value);
            }
        }
    }

    private static Object randomValue(Random r) {
        switch (r.nextInt(12)) {
            case 0:
                return null;
            case 1:
                return r.nextBoolean();
            case 2:
                return (long) (r.nextInt(7) - 2);
            case 3:
                return Long.MAX_VALUE;
            case 4:
                return r.nextGaussian() * 1e3;
            case 5:
                return -0.0;
            case 6:
                return 1e300;
            case 7:
                return "";
            case 8:
                return List.of("North", "South", "North");
            case 9:
                return new ArrayList<>();
            case 10:
                return Map.of("kind", "interaction");
            default:
                return List.of(List.of(1.0, 2.0), List.of(3.0));
        }
    }
}
