package rdstab.solver.assess;

import java.util.List;

/** The cautions printed with every result that bears on self-heating or runaway. */
public final class SafetyCautions {

    /** The standard cautions, in the order they are printed. */
    public static final List<String> STANDARD = List.of(
            "This is a model-based screening: the answer is only as good as the kinetic and heat-transfer data put in.",
            "It is no substitute for standard self-heating and thermal-stability tests, local codes and regulations, "
                    + "or the judgment of a licensed engineer.",
            "Judge the margin against the uncertainty of the inputs (kinetics, conductivity, cooling coefficient, size, "
                    + "ambient temperature): a small margin is not a safe one.");

    private SafetyCautions() {
    }
}
