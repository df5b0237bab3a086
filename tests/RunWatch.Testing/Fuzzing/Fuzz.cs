using System.Globalization;
using CsCheck;

namespace RunWatch.Testing.Fuzzing;

/// <summary>Byte-level mutations of corpus inputs for the property-based fuzz tests, and their time budget.</summary>
public static class Fuzz
{
    /// <summary>Seconds each fuzz target runs: RUNWATCH_FUZZ_SECONDS, default 10 (tens of seconds in CI, longer by hand).</summary>
    public static int Seconds =>
        int.TryParse(Environment.GetEnvironmentVariable("RUNWATCH_FUZZ_SECONDS"), NumberStyles.Integer, CultureInfo.InvariantCulture, out int s) && s > 0 ? s : 10;

    /// <summary>Up to eight edits (position, byte, kind) and a cut (per mille of the length kept, 1000 = none).</summary>
    public static readonly Gen<((int Position, byte Value, int Kind)[] Edits, int KeepPerMille)> Mutations =
        Gen.Select(Gen.Select(Gen.Int[0, 1 << 16], Gen.Byte, Gen.Int[0, 2]).Array[0, 8], Gen.OneOf(Gen.Const(1000), Gen.Int[0, 1000]));

    /// <summary>Applies the edits (0 replace, 1 insert, 2 delete a byte) and the cut to a copy of <paramref name="input"/>.</summary>
    public static byte[] Apply(byte[] input, ((int Position, byte Value, int Kind)[] Edits, int KeepPerMille) mutation)
    {
        ArgumentNullException.ThrowIfNull(input);
        var bytes = new List<byte>(input);
        foreach (var (position, value, kind) in mutation.Edits)
        {
            if (bytes.Count == 0)
            {
                bytes.Add(value);
                continue;
            }
            int at = position % bytes.Count;
            switch (kind)
            {
                case 0:
                    bytes[at] = value;
                    break;
                case 1:
                    bytes.Insert(at, value);
                    break;
                default:
                    bytes.RemoveAt(at);
                    break;
            }
        }
        int keep = (int)((long)bytes.Count * mutation.KeepPerMille / 1000);
        return [.. bytes.Take(keep)];
    }
}
