package rdstab.solver.units;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** Unit conversions go through the JSR 385 reference implementation (Indriya); values from SI definitions. */
class UnitsTest {

    @Test
    void celsiusAndKelvin() {
        // SI brochure: T/K = t/°C + 273.15
        assertEquals(298.15, QuantityParser.parse("25 degC").si(), 1e-12);
        assertEquals(298.15, QuantityParser.parse("25 °C").si(), 1e-12);
        assertEquals(25.0, QuantityParser.fromSi(298.15, QuantityParser.unit("degC")), 1e-12);
        assertEquals(300.0, QuantityParser.parse("300 K").si(), 0.0);
    }

    @Test
    void energyConductivityAndHeatTransfer() {
        // SI prefixes: k = 1e3
        assertEquals(92000.0, QuantityParser.parse("92 kJ/mol").si(), 1e-9);
        assertEquals(0.18, QuantityParser.parse("0.18 W/(m*K)").si(), 1e-15);
        assertEquals(10.0, QuantityParser.parse("10 W/(m^2*K)").si(), 1e-15);
        assertEquals(0.02, QuantityParser.parse("2 cm").si(), 1e-15);
        assertEquals(3.0e6, QuantityParser.parse("3.0e6 J/kg").si(), 1e-6, "exponent kept (Indriya's own reader drops it)");
        assertEquals(5e9, QuantityParser.parse("5e9 1/s").si(), 1.0);
        assertEquals(10800.0, QuantityParser.parse("3 h").si(), 1e-9);
        assertTrue(QuantityParser.sameDimension(QuantityParser.unit("W/(m*K)"), QuantityParser.unit("J/(s*m*K)")));
        assertTrue(!QuantityParser.sameDimension(QuantityParser.unit("W/(m*K)"), QuantityParser.unit("W/m")));
    }

    @Test
    void unknownUnitsAndGarbageAreRefused() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> QuantityParser.parse("0.18 furlongs"));
        assertTrue(e.getMessage().contains("unknown unit 'furlongs'"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> QuantityParser.parse("hot"));
    }
}
