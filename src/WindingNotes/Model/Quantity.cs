using System.Numerics;

namespace WindingNotes.Model;

/// <summary>How a pure number was written, where that changes its meaning (a tap at 25 % or at 25 turns).</summary>
[Flags]
public enum QuantityFlags : byte { None = 0, Percent = 1, Turns = 2 }

/// <summary>A complex value in SI units with its dimension.</summary>
public readonly record struct Quantity(Complex Value, Dimension Dimension, QuantityFlags Flags = QuantityFlags.None)
{
    public double Real => Value.Real;

    public double Magnitude => Value.Magnitude;

    public bool IsReal => Value.Imaginary == 0;

    public bool IsPercent => Flags.HasFlag(QuantityFlags.Percent);

    /// <summary>A number with no unit, no % and no 'turns': never a quantity, never a silent fraction.</summary>
    public bool IsBare => Dimension.IsNone && Flags == QuantityFlags.None;

    public static Quantity Number(double value) => new(value, Dimension.None);
}
