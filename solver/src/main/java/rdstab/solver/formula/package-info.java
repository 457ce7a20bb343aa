/**
 * The formula language of case files: small expressions such as {@code delta*exp(T/(1+eps*T))},
 * {@code -Bi*(u - ua)}, {@code A - (B+1)*u + u^2*v} or {@code 1 + 0.5*sin(pi*x)}.
 *
 * <h2>Which class to use</h2>
 * <ul>
 *   <li>{@link rdstab.solver.formula.Formula#parse} reads text; {@code names()} tells which
 *       variables and parameters it needs; {@code derivative(name)} gives exact symbolic
 *       derivatives (for Jacobians); {@code substitute(map)} fixes parameters.</li>
 *   <li>{@link rdstab.solver.formula.Formula#compile} gives a
 *       {@link rdstab.solver.formula.CompiledFormula} for evaluation at every mesh node: names
 *       are resolved to array slots once, constants are folded, small integer powers are
 *       multiplications.</li>
 *   <li>{@link rdstab.solver.formula.FormulaException} reports every problem with a
 *       {@link rdstab.solver.formula.FormulaException.Kind kind}, a 0-based character position
 *       and plain words.</li>
 * </ul>
 *
 * <h2>Grammar (EBNF)</h2>
 * <pre>
 * formula  = expr ;
 * expr     = term , { ( "+" | "-" ) , term } ;          (* left to right *)
 * term     = unary , { ( "*" | "/" ) , unary } ;        (* left to right *)
 * unary    = ( "-" | "+" ) , unary | power ;
 * power    = primary , [ "^" , unary ] ;               (* right to left: 2^3^2 = 512; -x^2 = -(x^2) *)
 * primary  = number | name | call | "(" , expr , ")" ;
 * call     = function , "(" , [ expr , { "," , expr } ] , ")" ;
 * number   = ( digits , [ "." , [ digits ] ] | "." , digits ) , [ ( "e" | "E" ) , [ "+" | "-" ] , digits ] ;
 * name     = ( letter | "_" ) , { letter | digit | "_" } ;   (* ASCII only *)
 * function = "exp" | "log" | "sqrt" | "sin" | "cos" | "tan" | "tanh" | "abs" | "sign"
 *          | "min" | "max" | "pow" | "ifle" ;
 * </pre>
 * Blanks, tabs and line breaks may separate tokens. Any other character is a syntax error.
 *
 * <h2>Names and functions</h2>
 * <ul>
 *   <li>{@code pi} is the built-in constant Math.PI. It is not a free name and cannot be
 *       shadowed: values given for "pi" are ignored.</li>
 *   <li>Function names are reserved: {@code exp} without parentheses is a syntax error.</li>
 *   <li>{@code log} is the natural logarithm; {@code pow(a, b)} is the same as {@code a^b};
 *       {@code min} and {@code max} take two arguments.</li>
 *   <li>{@code sign(a)} is -1, 0 or 1 (NaN stays NaN) and {@code ifle(a, b, p, q)} is {@code p}
 *       when {@code a <= b}, else {@code q}. They exist because derivatives need them
 *       ({@code d abs(a) = sign(a)*a'}; {@code d min(a, b) = ifle(a, b, a', b')}, the first
 *       argument winning a tie), and printed derivatives must read back; they may be used in
 *       case files too.</li>
 * </ul>
 *
 * <h2>Limits</h2>
 * Text longer than {@link rdstab.solver.formula.Formula#MAX_LENGTH} characters is rejected
 * before it is read. Nesting deeper than {@link rdstab.solver.formula.Formula#MAX_DEPTH} levels
 * is rejected; parentheses, signs, function calls and exponents each open a level, and a chain of
 * binary operators counts one level per operator (so {@code x+x+...} with more than 200 terms is
 * too deep). This keeps every walk over the tree well within the Java stack. Derivatives of
 * formulas near the limit can be deeper than the limit; they still evaluate, but their printed
 * text may not read back.
 */
package rdstab.solver.formula;
