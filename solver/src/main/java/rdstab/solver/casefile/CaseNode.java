package rdstab.solver.casefile;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.snakeyaml.engine.v2.nodes.MappingNode;
import org.snakeyaml.engine.v2.nodes.Node;
import org.snakeyaml.engine.v2.nodes.NodeTuple;
import org.snakeyaml.engine.v2.nodes.ScalarNode;
import org.snakeyaml.engine.v2.nodes.SequenceNode;
import rdstab.solver.error.InputException;

/**
 * A YAML node with its key path and file position, so that every error can say where it is.
 * Used only while reading a case file.
 */
final class CaseNode {

    private final Node node;
    private final String path;
    private final String source;

    CaseNode(Node node, String path, String source) {
        this.node = node;
        this.path = path;
        this.source = source;
    }

    /** line:column (1-based) and key path. */
    String place() {
        return node.getStartMark().map(m -> (m.getLine() + 1) + ":" + (m.getColumn() + 1)).orElse("?")
                + " (" + (path.isEmpty() ? "top level" : path) + ")";
    }

    /** 1-based line and column of the first character of a scalar's text, for formula positions. */
    int[] lineColumn() {
        return node.getStartMark().map(m -> new int[] {m.getLine() + 1, m.getColumn() + 1}).orElse(new int[] {0, 0});
    }

    String path() {
        return path;
    }

    String source() {
        return source;
    }

    InputException error(String problem) {
        return new InputException(source, place(), problem);
    }

    boolean isMap() {
        return node instanceof MappingNode;
    }

    boolean isScalar() {
        return node instanceof ScalarNode;
    }

    boolean isList() {
        return node instanceof SequenceNode;
    }

    /** The entries of a mapping, in file order; keys must be plain scalars. */
    Map<String, CaseNode> entries() {
        if (!isMap()) {
            throw error("expected a mapping of 'key: value' lines here, found " + kindWord());
        }
        Map<String, CaseNode> out = new LinkedHashMap<>();
        for (NodeTuple t : ((MappingNode) node).getValue()) {
            if (!(t.getKeyNode() instanceof ScalarNode)) {
                throw new CaseNode(t.getKeyNode(), path, source).error("keys must be plain words");
            }
            String key = ((ScalarNode) t.getKeyNode()).getValue();
            if (out.containsKey(key)) {
                throw new CaseNode(t.getKeyNode(), path, source).error("duplicate key '" + key + "'");
            }
            out.put(key, new CaseNode(t.getValueNode(), path.isEmpty() ? key : path + "." + key, source));
        }
        return out;
    }

    /** Entries, refusing any key not in {@code allowed} (the message lists the allowed keys). */
    Map<String, CaseNode> entries(Set<String> allowed) {
        Map<String, CaseNode> e = entries();
        for (Map.Entry<String, CaseNode> x : e.entrySet()) {
            if (!allowed.contains(x.getKey())) {
                throw x.getValue().keyError("unknown key '" + x.getKey() + "'" + suggestion(x.getKey(), allowed)
                        + "; expected one of: " + String.join(", ", allowed));
            }
        }
        return e;
    }

    private InputException keyError(String problem) {
        return error(problem);
    }

    /** Items of a sequence. */
    List<CaseNode> items() {
        if (!isList()) {
            throw error("expected a list ('- ' items) here, found " + kindWord());
        }
        List<CaseNode> out = new ArrayList<>();
        List<Node> v = ((SequenceNode) node).getValue();
        for (int i = 0; i < v.size(); i++) {
            out.add(new CaseNode(v.get(i), path + "[" + i + "]", source));
        }
        return out;
    }

    /** Text of a scalar. */
    String text() {
        if (!isScalar()) {
            throw error("expected a single value here, found " + kindWord());
        }
        return ((ScalarNode) node).getValue();
    }

    /** True when the scalar was written in quotes (its formula positions shift by one). */
    boolean quoted() {
        return isScalar() && ((ScalarNode) node).getScalarStyle().toString().contains("QUOTED");
    }

    /** A plain number. */
    double number() {
        String t = text().trim();
        try {
            double v = Double.parseDouble(t);
            if (!Double.isFinite(v)) {
                throw error("expected a finite number, found '" + t + "'");
            }
            return v;
        } catch (NumberFormatException e) {
            throw error("expected a number, found '" + t + "'");
        }
    }

    /** A whole number within [min, max]. */
    int integer(int min, int max) {
        String t = text().trim();
        long v;
        try {
            v = Long.parseLong(t);
        } catch (NumberFormatException e) {
            throw error("expected a whole number, found '" + t + "'");
        }
        if (v < min || v > max) {
            throw error("expected a whole number from " + min + " to " + max + ", found " + v);
        }
        return (int) v;
    }

    private String kindWord() {
        if (isMap()) {
            return "a mapping";
        }
        if (isList()) {
            return "a list";
        }
        return "the value '" + ((ScalarNode) node).getValue() + "'";
    }

    /** ", did you mean 'x'?" when a close allowed key exists (edit distance ≤ 2). */
    static String suggestion(String key, Set<String> allowed) {
        String best = null;
        int bestD = 3;
        for (String a : allowed) {
            int d = distance(key.toLowerCase(java.util.Locale.ROOT), a.toLowerCase(java.util.Locale.ROOT));
            if (d < bestD) {
                bestD = d;
                best = a;
            }
        }
        return best == null ? "" : " (did you mean '" + best + "'?)";
    }

    private static int distance(String a, String b) {
        int[] prev = new int[b.length() + 1];
        int[] cur = new int[b.length() + 1];
        for (int j = 0; j <= b.length(); j++) {
            prev[j] = j;
        }
        for (int i = 1; i <= a.length(); i++) {
            cur[0] = i;
            for (int j = 1; j <= b.length(); j++) {
                int c = a.charAt(i - 1) == b.charAt(j - 1) ? 0 : 1;
                cur[j] = Math.min(Math.min(cur[j - 1] + 1, prev[j] + 1), prev[j - 1] + c);
            }
            int[] t = prev;
            prev = cur;
            cur = t;
        }
        return prev[b.length()];
    }
}
