using WindingNotes.Model;

namespace WindingNotes.Solve;

/// <summary>
/// The thermal model of IEC 60076-7 (its clause on the calculation of hot-spot temperatures):
/// top-oil rise from the losses, hot-spot gradient from each winding's current, two time constants
/// (oil, winding) and the overshoot of the hot-spot over the oil that k21 and k22 describe; ageing
/// from the hot-spot temperature. Rises in K, times in s.
/// </summary>
public static class ThermalEquations
{
    /// <summary>Ultimate top-oil rise at load factor K² (load loss over rated load loss): Δθor·[(1 + R·K²)/(1 + R)]^x.</summary>
    public static double TopOilRise(ThermalUnitModel u, double ratio, double k2) =>
        u.TopOilRise * Math.Pow((1 + ratio * k2) / (1 + ratio), u.X);

    /// <summary>Ultimate hot-spot to top-oil gradient at load factor K: H·gr·K^y.</summary>
    public static double HotSpotGradient(ThermalUnitModel u, double k) => u.HotSpotGradient * Math.Pow(k, u.Y);

    /// <summary>Relative ageing rate at hot-spot θh (°C): 2^((θh − 98)/6) for non-upgraded paper, exp(15000/383 − 15000/(θh + 273)) for thermally upgraded paper.</summary>
    public static double AgeingRate(double hotSpotCelsius, bool upgraded) =>
        upgraded ? Math.Exp(15000.0 / (110 + 273) - 15000.0 / (hotSpotCelsius + 273)) : Math.Pow(2, (hotSpotCelsius - 98) / 6);

    /// <summary>
    /// A unit's relative ageing rate at hot-spot θh (°C): its paper's (<see cref="AgeingRate(double, bool)"/>),
    /// or for a dry-type unit 2^((θh − θr)/10), θr its class's rated hot-spot: the life of an insulation
    /// system halves every 10 K (the halving interval that thermal endurance tests of insulation
    /// systems take unless measured, IEC 60216; common practice, from memory), 1 at the rated hot-spot.
    /// </summary>
    public static double AgeingRate(ThermalUnitModel u, double hotSpotCelsius) =>
        u.Dry ? Math.Pow(2, (hotSpotCelsius - DryReference(u)) / 10) : AgeingRate(hotSpotCelsius, u.Upgraded);

    /// <summary>The hot-spot (°C) at which a unit ages at the rate of 1: 98 °C, 110 °C for upgraded paper, a dry-type class's rated hot-spot.</summary>
    public static double AgeingReference(ThermalUnitModel u) => u.Dry ? DryReference(u) : u.Upgraded ? 110 : 98;

    private static double DryReference(ThermalUnitModel u) =>
        u.InsulationClass is { } c && Model.BindRun.DryClasses.TryGetValue(c, out var data) ? data.RatedHotSpot : double.NaN;

    /// <summary>
    /// IEEE C57.91's aging acceleration factor F_AA = exp(15000/383 − 15000/(θH + 273)) at the
    /// winding hottest-spot θH (°C): 1 at 110 °C, the reference of insulation of 65 °C average
    /// winding rise (thermally upgraded paper); defined for oil-immersed units only.
    /// </summary>
    public static double AgingAccelerationFactor(double hotSpotCelsius) => Math.Exp(15000.0 / 383 - 15000.0 / (hotSpotCelsius + 273));

    /// <summary>
    /// The state of one unit: the top-oil rise and, per winding, the two parts of the hot-spot
    /// gradient: Δθh = Δθh1 − Δθh2, the first rising with the winding time constant, the second (the
    /// oil's delayed flow) taking back the overshoot with the oil's.
    /// </summary>
    public sealed class State(int windings)
    {
        public double TopOil;
        public readonly double[] H1 = new double[windings], H2 = new double[windings];

        /// <summary>For the exponential method: the rises when the load last changed, and the time since.</summary>
        public double TopOilStart;
        public readonly double[] GradientStart = new double[windings];
        public double Since;

        public double Gradient(int w) => H1[w] - H2[w];

        /// <summary>The steady state at these ultimate rises.</summary>
        public void Settle(ThermalUnitModel u, double topOil, ReadOnlySpan<double> gradients)
        {
            TopOil = TopOilStart = topOil;
            for (var w = 0; w < H1.Length; w++)
            {
                H1[w] = u.K21 * gradients[w];
                H2[w] = (u.K21 - 1) * gradients[w];
                GradientStart[w] = gradients[w];
            }
            Since = 0;
        }

        /// <summary>One step of the difference equations towards the ultimate rises.</summary>
        public void Step(ThermalUnitModel u, double dt, double topOil, ReadOnlySpan<double> gradients)
        {
            TopOil += dt / (u.K11 * u.OilTimeConstant) * (topOil - TopOil);
            for (var w = 0; w < H1.Length; w++)
            {
                H1[w] += dt / (u.K22 * u.WindingTimeConstant) * (u.K21 * gradients[w] - H1[w]);
                H2[w] += dt / (u.OilTimeConstant / u.K22) * ((u.K21 - 1) * gradients[w] - H2[w]);
            }
        }

        /// <summary>
        /// The exponential response to a step of load held since it changed: the oil rise moves
        /// towards its end value with k11·τo; a winding whose gradient rises follows
        /// f2(t) = k21·(1 − e^(−t/(k22·τw))) − (k21 − 1)·(1 − e^(−t/(τo/k22))), one whose gradient
        /// falls takes its end value at once.
        /// </summary>
        public void Exponential(ThermalUnitModel u, double dt, double topOil, ReadOnlySpan<double> gradients, bool changed)
        {
            if (changed)
            {
                TopOilStart = TopOil;
                for (var w = 0; w < H1.Length; w++) GradientStart[w] = Gradient(w);
                Since = 0;
            }
            Since += dt;
            TopOil = topOil + (TopOilStart - topOil) * Math.Exp(-Since / (u.K11 * u.OilTimeConstant));
            var f2 = F2(u, Since);
            for (var w = 0; w < H1.Length; w++)
            {
                var g = gradients[w] >= GradientStart[w] ? GradientStart[w] + (gradients[w] - GradientStart[w]) * f2 : gradients[w];
                H1[w] = g;
                H2[w] = 0;
            }
        }
    }

    /// <summary>The hot-spot gradient's response to a unit step: f2(t) of IEC 60076-7.</summary>
    public static double F2(ThermalUnitModel u, double t) =>
        u.K21 * (1 - Math.Exp(-t / (u.K22 * u.WindingTimeConstant))) - (u.K21 - 1) * (1 - Math.Exp(-t / (u.OilTimeConstant / u.K22)));
}
