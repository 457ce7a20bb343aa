package rdstab.solver.sweep;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import rdstab.solver.error.InputException;

/** Grid values, chains and shards: every point once, chains independent of the shard count. */
class SweepGridTest {

    @Test
    void endsAreExactAndLogSpacingIsGeometric() {
        Axis a = Axis.parse("delta=0.1:0.7:7");
        assertEquals(0.1, a.value(0));
        assertEquals(0.7, a.value(6));
        assertEquals(0.4, a.value(3), 1e-15);
        Axis b = Axis.parse("Bi=1:1000:4:log");
        // log spacing of 1..1000 in 4 values: 1, 10, 100, 1000 (common practice, no source)
        assertEquals(10, b.value(1), 1e-12);
        assertEquals(100, b.value(2), 1e-10);
        assertEquals(1000.0, b.value(3));
        assertEquals(2.5, Axis.parse("x=2.5:9:1").value(0));
    }

    @Test
    void badSpecificationsAreInputErrors() {
        for (String s : new String[] {"delta=1:1:5", "delta=0:1:0", "delta=0:1:-3", "Bi=0:10:5:log", "Bi=-1:10:5:log",
            "delta=0:1", "delta", "=0:1:3", "delta=a:1:3", "delta=0:1:3:lin", "delta=0:1:2.5", "delta=0:NaN:3"}) {
            assertThrows(InputException.class, () -> Axis.parse(s), s);
        }
        for (String s : new String[] {"4/4", "-1/2", "a/b", "1", "0/0", "1/2/3"}) {
            assertThrows(InputException.class, () -> Shard.parse(s), s);
        }
        assertEquals(new Shard(3, 4), Shard.parse("3/4"));
    }

    @Test
    void shardsPartitionThePointsIntoWholeChains() {
        Random rnd = new Random(20240611L);
        for (int trial = 0; trial < 50; trial++) {
            int n1 = 1 + rnd.nextInt(30);
            int n2 = 1 + rnd.nextInt(5);
            List<Axis> axes = new ArrayList<>(List.of(new Axis("a", 0, 1, n1, false)));
            if (n2 > 1) {
                axes.add(new Axis("b", 1, 2, n2, false));
            }
            SweepGrid g = new SweepGrid(axes, 1 + rnd.nextInt(10));
            int shards = 1 + rnd.nextInt(6);
            List<Integer> all = new ArrayList<>();
            for (int s = 0; s < shards; s++) {
                for (int p : g.pointsOf(new Shard(s, shards))) {
                    all.add(p);
                }
            }
            Collections.sort(all);
            assertEquals(g.points(), all.size(), "every point exactly once");
            for (int p = 0; p < all.size(); p++) {
                assertEquals(p, all.get(p).intValue());
            }
            for (int k = 0; k < g.chains(); k++) {
                int[] c = g.chain(k);
                assertTrue(c.length >= 1 && c.length <= g.chainLength());
                for (int i = 1; i < c.length; i++) {
                    assertEquals(c[i - 1] + 1, c[i], "consecutive points");
                    if (axes.size() == 2) {
                        assertEquals(g.values(c[0])[1], g.values(c[i])[1], "one line of the first axis");
                    }
                }
            }
        }
    }

    @Test
    void chainsAreRunsAlongTheFirstParameter() {
        SweepGrid g = new SweepGrid(List.of(Axis.parse("a=0:1:5"), Axis.parse("b=0:1:2")), 2);
        assertEquals(6, g.chains());
        assertArrayEquals(new int[] {0, 1}, g.chain(0));
        assertArrayEquals(new int[] {4}, g.chain(2));
        assertArrayEquals(new int[] {5, 6}, g.chain(3));
        assertArrayEquals(new double[] {0.25, 1.0}, g.values(6));
        assertArrayEquals(new int[] {0, 1, 5, 6}, g.pointsOf(new Shard(0, 3)), "chains 0 and 3");
    }
}
