package rdstab.solver.setup;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import rdstab.mesh.assembly.PointKernel;
import rdstab.solver.error.ConvergenceException;
import rdstab.solver.formula.CompiledFormula;
import rdstab.solver.formula.Formula;
import rdstab.solver.model.Case;
import rdstab.solver.model.FieldSpec;

/**
 * The case's formulas as a {@link PointKernel}: sources, diffusivities and drifts compiled once
 * (parameters folded in as constants) with their exact symbolic derivatives with respect to every
 * field. Evaluation reads a slot array [fields..., coordinates...], so no names are looked up per node.
 * Not thread-safe; {@link #copy()} gives an independent instance.
 */
public final class FormulaKernel implements PointKernel {

    private final List<String> fieldNames;
    private final List<String> coordNames;
    private final Formula[] sourceText;
    private final Formula[] diffText;
    private final CompiledFormula[] source;
    private final CompiledFormula[][] dSource;
    private final CompiledFormula[] diff;
    private final CompiledFormula[][] dDiff;
    private final CompiledFormula[] drift;
    private final boolean kDependsOnFields;
    private final int dim;
    private final double[] vars;

    /** Compiles the formulas of a case at its current parameter values. */
    public FormulaKernel(Case c) {
        this.fieldNames = c.fieldNames();
        this.coordNames = c.coordinateNames();
        this.dim = c.shape().dimension();
        int n = fieldNames.size();
        List<String> variables = new ArrayList<>(fieldNames);
        variables.addAll(coordNames);
        Map<String, Double> p = c.parameters();
        sourceText = new Formula[n];
        diffText = new Formula[n];
        source = new CompiledFormula[n];
        diff = new CompiledFormula[n];
        dSource = new CompiledFormula[n][n];
        dDiff = new CompiledFormula[n][n];
        drift = new CompiledFormula[n];
        boolean kField = false;
        for (int f = 0; f < n; f++) {
            FieldSpec spec = c.fields().get(f);
            sourceText[f] = spec.source().substitute(p);
            diffText[f] = spec.diffusivity().substitute(p);
            source[f] = sourceText[f].compile(variables, p);
            diff[f] = diffText[f].compile(variables, p);
            for (int g = 0; g < n; g++) {
                dSource[f][g] = compiledUnlessZero(sourceText[f].derivative(fieldNames.get(g)), variables, p);
                dDiff[f][g] = compiledUnlessZero(diffText[f].derivative(fieldNames.get(g)), variables, p);
                kField |= dDiff[f][g] != null;
            }
            drift[f] = spec.drift() == null ? null : compiledUnlessZero(spec.drift().substitute(p), variables, p);
        }
        this.kDependsOnFields = kField;
        this.vars = new double[n + coordNames.size()];
    }

    private FormulaKernel(FormulaKernel o) {
        this.fieldNames = o.fieldNames;
        this.coordNames = o.coordNames;
        this.dim = o.dim;
        this.sourceText = o.sourceText;
        this.diffText = o.diffText;
        this.source = o.source;
        this.dSource = o.dSource;
        this.diff = o.diff;
        this.dDiff = o.dDiff;
        this.drift = o.drift;
        this.kDependsOnFields = o.kDependsOnFields;
        this.vars = new double[o.vars.length];
    }

    private static CompiledFormula compiledUnlessZero(Formula f, List<String> variables, Map<String, Double> p) {
        if (f.isConstant() && f.constantValue() == 0.0) {
            return null;
        }
        return f.compile(variables, p);
    }

    @Override
    public int fieldCount() {
        return fieldNames.size();
    }

    private void load(double[] x, double[] u) {
        int n = fieldNames.size();
        System.arraycopy(u, 0, vars, 0, n);
        vars[n] = x[0];
        if (vars.length > n + 1) {
            vars[n + 1] = dim == 2 ? x[1] : x[0];
        }
    }

    @Override
    public void source(double[] x, double[] u, double[] s, double[][] dsdu) {
        load(x, u);
        int n = s.length;
        for (int f = 0; f < n; f++) {
            s[f] = check(source[f].evaluate(vars), "source", f, x, u);
            for (int g = 0; g < n; g++) {
                dsdu[f][g] = dSource[f][g] == null ? 0.0 : check(dSource[f][g].evaluate(vars), "source derivative", f, x, u);
            }
        }
    }

    @Override
    public void diffusivity(double[] x, double[] u, double[] k, double[][] dkdu) {
        load(x, u);
        int n = k.length;
        for (int f = 0; f < n; f++) {
            k[f] = check(diff[f].evaluate(vars), "diffusivity", f, x, u);
            for (int g = 0; g < n; g++) {
                dkdu[f][g] = dDiff[f][g] == null ? 0.0 : check(dDiff[f][g].evaluate(vars), "diffusivity derivative", f, x, u);
            }
        }
    }

    @Override
    public double drift(int field, double[] x, int dir) {
        if (drift[field] == null || dir != 0) {
            return 0.0;
        }
        Arrays.fill(vars, 0.0);
        vars[fieldNames.size()] = x[0];
        if (vars.length > fieldNames.size() + 1) {
            vars[fieldNames.size() + 1] = dim == 2 ? x[1] : x[0];
        }
        return drift[field].evaluate(vars);
    }

    @Override
    public boolean hasDrift() {
        for (CompiledFormula d : drift) {
            if (d != null) {
                return true;
            }
        }
        return false;
    }

    @Override
    public boolean diffusivityDependsOnFields() {
        return kDependsOnFields;
    }

    /** True when the sources couple the fields asymmetrically or drift is present (not self-adjoint). */
    public boolean possiblySelfAdjoint() {
        return fieldNames.size() == 1 && !hasDrift();
    }

    @Override
    public PointKernel copy() {
        return new FormulaKernel(this);
    }

    private double check(double v, String what, int f, double[] x, double[] u) {
        if (Double.isFinite(v)) {
            return v;
        }
        StringBuilder sb = new StringBuilder();
        sb.append(what).append(" of field '").append(fieldNames.get(f)).append("' (")
          .append(what.startsWith("source") ? sourceText[f] : diffText[f]).append(") is ").append(v).append(" at ");
        for (int d = 0; d < x.length; d++) {
            sb.append(d == 0 ? "x=" : ", y=").append(fmt(x[d]));
        }
        for (int g = 0; g < u.length; g++) {
            sb.append(", ").append(fieldNames.get(g)).append('=').append(fmt(u[g]));
        }
        throw new ConvergenceException(ConvergenceException.Reason.NOT_FINITE, sb.toString(), -1, Double.NaN);
    }

    private static String fmt(double v) {
        return String.format(Locale.ROOT, "%.6g", v);
    }
}
