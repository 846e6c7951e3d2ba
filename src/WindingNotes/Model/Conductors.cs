namespace WindingNotes.Model;

/// <summary>Conductor data from the standards, each beside its source.</summary>
public static class Conductors
{
    /// <summary>Annealed copper at 20 °C: 1/58 Ω·mm²/m = 0.017241 Ω·mm²/m (IEC 60028).</summary>
    public const double CopperResistivity20 = 0.017241e-6;

    /// <summary>Hard-drawn aluminium at 20 °C, 61 % IACS: 0.028264 Ω·mm²/m (IEC 60889, from memory).</summary>
    public const double AluminiumResistivity20 = 0.028264e-6;

    /// <summary>The temperature constant K of R_T = R_t (K + T)/(K + t): 234.5 for copper, 225 for aluminium (IEEE C57.12.90).</summary>
    public static double TemperatureConstant(ConductorMaterial material) => material == ConductorMaterial.Copper ? 234.5 : 225.0;

    public static double Resistivity20(ConductorMaterial material) =>
        material == ConductorMaterial.Copper ? CopperResistivity20 : AluminiumResistivity20;

    /// <summary>Diameter of an AWG size: d = 0.127 mm · 92^((36 − n)/39) (ASTM B258). Sizes 0, 00, 000, 0000 are n = 0, −1, −2, −3.</summary>
    public static double AwgDiameter(double gauge) => 0.127e-3 * Math.Pow(92, (36 - gauge) / 39);

    public static double AwgArea(double gauge)
    {
        var d = AwgDiameter(gauge);
        return Math.PI / 4 * d * d;
    }

    /// <summary>Corrects a resistance from one temperature to another, both in kelvin (IEEE C57.12.90).</summary>
    public static double Correct(double resistance, double fromKelvin, double toKelvin, ConductorMaterial material)
    {
        var k = TemperatureConstant(material);
        return resistance * (k + toKelvin - 273.15) / (k + fromKelvin - 273.15);
    }
}
