package rdstab.cli.report;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import rdstab.solver.assess.Assessment;
import rdstab.solver.drive.CheckResult;
import rdstab.solver.eigen.EigenPair;

/**
 * The result JSON of the interface contract (ARCHITECTURE.md): verdict, growth_rate, leading,
 * base, energy, unknowns, parameters, cautions — plus extra keys (assessment details, evidence).
 * Non-finite numbers are written as null.
 */
public final class ResultJson {

    private static final ObjectMapper MAPPER = new ObjectMapper().disable(SerializationFeature.FAIL_ON_EMPTY_BEANS);

    private ResultJson() {
    }

    /** One JSON object on one line. */
    public static String toJson(CheckResult r) {
        return write(toMap(r));
    }

    /** Serializes any map tree on one line. */
    public static String write(Object tree) {
        try {
            return MAPPER.writeValueAsString(tree);
        } catch (JsonProcessingException e) {
            throw new IllegalStateException("JSON serialization failed: " + e.getMessage(), e);
        }
    }

    /** The result as an ordered map tree (for embedding in other outputs). */
    public static Map<String, Object> toMap(CheckResult r) {
        Assessment a = r.assessment();
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("verdict", a.verdict().word());
        m.put("growth_rate", num(a.growthRate()));
        List<Object> leading = new ArrayList<>();
        for (int i = 0; i < r.modes().size(); i++) {
            EigenPair e = r.modes().get(i);
            Map<String, Object> x = new LinkedHashMap<>();
            x.put("re", num(e.re()));
            x.put("im", num(e.im()));
            x.put("residual", num(e.residual()));
            if (i < r.conditioning().size()) {
                x.put("error_estimate", num(r.conditioning().get(i).errorEstimate()));
                x.put("condition", num(r.conditioning().get(i).sensitivity()));
            }
            leading.add(x);
        }
        m.put("leading", leading);
        Map<String, Object> base = new LinkedHashMap<>();
        Map<String, Object> max = new LinkedHashMap<>();
        r.baseMax().forEach((k, v) -> max.put(k, num(v)));
        base.put("max", max);
        base.put("newton_iterations", r.base().iterations());
        base.put("residual", num(r.base().residual()));
        base.put("tolerance", num(r.base().tolerance()));
        m.put("base", base);
        Map<String, Object> energy = new LinkedHashMap<>();
        energy.put("bound", num(r.energy().bound()));
        energy.put("numerical_abscissa", num(r.energy().numericalAbscissa()));
        energy.put("spectral_abscissa", num(a.growthRate()));
        energy.put("poincare", num(r.energy().poincare()));
        energy.put("reaction_rate", num(r.energy().reactionRate()));
        energy.put("weights", r.energy().weights());
        energy.put("weight_choice", r.energy().weightChoice());
        energy.put("unit_weight_bound", num(r.energy().unitWeightBound()));
        energy.put("poincare_analytic", num(r.energy().analyticPoincare()));
        energy.put("poincare_source", r.energy().poincareSource());
        energy.put("peak_amplification", num(r.energy().peakAmplification()));
        energy.put("peak_time", num(r.energy().peakTime()));
        energy.put("amplification_note", r.energy().amplificationNote());
        energy.put("verdict", a.energyVerdict());
        m.put("energy", energy);
        m.put("unknowns", r.problem().full().unknowns());
        Map<String, Object> params = new LinkedHashMap<>();
        r.problem().theCase().parameters().forEach((k, v) -> params.put(k, num(v)));
        m.put("parameters", params);
        m.put("cautions", a.cautions());
        m.put("band", num(a.band()));
        m.put("e_folding_time", num(a.eFoldingTime()));
        m.put("frequency", num(a.frequency()));
        Map<String, Object> peak = new LinkedHashMap<>();
        peak.put("field", a.peakField());
        peak.put("x", a.peakX());
        m.put("leading_mode_peak", peak);
        m.put("shift", num(r.shift()));
        m.put("scaling_span", num(r.scalingSpan()));
        m.put("rightmost_certified", r.rightmostCertified());
        m.put("cells", r.problem().theCase().mesh().cells());
        m.put("warnings", a.warnings());
        if (PhysicalTerms.applies(r)) {
            m.put("physical", PhysicalTerms.toMap(r));
        }
        PatternReport.put(r, m);
        return m;
    }

    /** A finite number, or null. */
    public static Object num(double v) {
        return Double.isFinite(v) ? (Object) v : null;
    }
}
