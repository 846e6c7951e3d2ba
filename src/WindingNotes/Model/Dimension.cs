namespace WindingNotes.Model;

/// <summary>
/// W, VA and var have one SI dimension; the notation keeps them apart with this tag.
/// <see cref="Any"/> is a power computed from other quantities (V × A), which fits every kind.
/// </summary>
public enum PowerKind : byte { Any, Active, Reactive, Apparent }

/// <summary>
/// Exponents of the base dimensions (mass, length, time, current, temperature, and plane angle
/// kept as a dimension of its own so an angle cannot stand where a number does), plus the power
/// kind. Products add exponents, quotients subtract them.
/// </summary>
public readonly record struct Dimension(sbyte Mass, sbyte Length, sbyte Time, sbyte Current, sbyte Temperature, sbyte Angle, PowerKind Power = PowerKind.Any)
{
    public static readonly Dimension None = default;
    public static readonly Dimension Voltage = new(1, 2, -3, -1, 0, 0);
    public static readonly Dimension CurrentDim = new(0, 0, 0, 1, 0, 0);
    public static readonly Dimension PowerAny = new(1, 2, -3, 0, 0, 0);
    public static readonly Dimension ActivePower = PowerAny with { Power = PowerKind.Active };
    public static readonly Dimension ReactivePower = PowerAny with { Power = PowerKind.Reactive };
    public static readonly Dimension ApparentPower = PowerAny with { Power = PowerKind.Apparent };
    public static readonly Dimension Impedance = new(1, 2, -3, -2, 0, 0);
    public static readonly Dimension Frequency = new(0, 0, -1, 0, 0, 0);
    public static readonly Dimension FluxDensity = new(1, 0, -2, -1, 0, 0);
    public static readonly Dimension Inductance = new(1, 2, -2, -2, 0, 0);
    public static readonly Dimension LengthDim = new(0, 1, 0, 0, 0, 0);
    public static readonly Dimension Area = new(0, 2, 0, 0, 0, 0);
    public static readonly Dimension TemperatureDim = new(0, 0, 0, 0, 1, 0);
    public static readonly Dimension TimeDim = new(0, 0, 1, 0, 0, 0);
    public static readonly Dimension AngleDim = new(0, 0, 0, 0, 0, 1);

    public bool IsNone => this == None;

    public bool IsPower => WithoutPower == PowerAny;

    private Dimension WithoutPower => this with { Power = PowerKind.Any };

    /// <summary>Same exponents, and power kinds that agree (a computed power fits every kind).</summary>
    public bool Fits(Dimension other) =>
        WithoutPower == other.WithoutPower && (Power == other.Power || Power == PowerKind.Any || other.Power == PowerKind.Any);

    public static Dimension operator *(Dimension a, Dimension b) => Combine(a, b, 1);

    public static Dimension operator /(Dimension a, Dimension b) => Combine(a, b, -1);

    private static Dimension Combine(Dimension a, Dimension b, int sign) => new(
        (sbyte)(a.Mass + sign * b.Mass), (sbyte)(a.Length + sign * b.Length), (sbyte)(a.Time + sign * b.Time),
        (sbyte)(a.Current + sign * b.Current), (sbyte)(a.Temperature + sign * b.Temperature), (sbyte)(a.Angle + sign * b.Angle),
        // A power times a pure number stays the kind it was; any other product is a new quantity.
        b.IsNone ? a.Power : a.IsNone && sign > 0 ? b.Power : PowerKind.Any);

    /// <summary>The square root, or null when an exponent is odd.</summary>
    public Dimension? Sqrt()
    {
        sbyte[] e = [Mass, Length, Time, Current, Temperature, Angle];
        if (e.Any(x => x % 2 != 0)) return null;
        return new((sbyte)(Mass / 2), (sbyte)(Length / 2), (sbyte)(Time / 2), (sbyte)(Current / 2), (sbyte)(Temperature / 2), (sbyte)(Angle / 2));
    }

    /// <summary>What the dimension is called in messages: "a voltage", "an area", else its SI unit.</summary>
    public string Describe()
    {
        foreach (var (dimension, name) in Names)
            if (this == dimension) return name;
        return $"a quantity in {SiUnit()}";
    }

    /// <summary>The SI unit a value of this dimension is shown in.</summary>
    public string SiUnit()
    {
        foreach (var (dimension, unit) in Units)
            if (WithoutPower == dimension.WithoutPower && (dimension.Power == Power || !IsPower)) return unit;
        var parts = new List<string>();
        void Add(string symbol, int exponent)
        {
            if (exponent != 0) parts.Add(exponent == 1 ? symbol : $"{symbol}^{exponent}");
        }
        Add("kg", Mass); Add("m", Length); Add("s", Time); Add("A", Current); Add("K", Temperature); Add("rad", Angle);
        return parts.Count == 0 ? "" : string.Join("·", parts);
    }

    private static readonly (Dimension, string)[] Names =
    [
        (None, "a number"), (Voltage, "a voltage"), (CurrentDim, "a current"), (ActivePower, "an active power"),
        (ReactivePower, "a reactive power"), (ApparentPower, "an apparent power"), (PowerAny, "a power"),
        (Impedance, "an impedance"), (Frequency, "a frequency"), (FluxDensity, "a flux density"),
        (Inductance, "an inductance"), (LengthDim, "a length"), (Area, "an area"), (TemperatureDim, "a temperature"),
        (TimeDim, "a time"), (AngleDim, "an angle"),
    ];

    private static readonly (Dimension, string)[] Units =
    [
        (Voltage, "V"), (CurrentDim, "A"), (ActivePower, "W"), (ReactivePower, "var"), (ApparentPower, "VA"), (PowerAny, "VA"),
        (Impedance, "ohm"), (Frequency, "Hz"), (FluxDensity, "T"), (Inductance, "H"), (LengthDim, "m"), (Area, "m2"),
        (TemperatureDim, "K"), (TimeDim, "s"), (AngleDim, "rad"),
    ];
}
