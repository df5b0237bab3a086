namespace RunWatch.Core.Model.Diffusion;

/// <summary>
/// λ_eff: the constant capture length that, held over the whole covered growth time, makes the field's unguarded
/// wires collect as much in total as they did over the real history: Σ_i A_i(λ_eff)·t = Σ_i ∫A_i(λ(T(t))) dt.
/// Since collection grows with λ, at most one λ does this; it is found by bisection in ln λ on the table. A history
/// held at one temperature gives that temperature's λ exactly. An excursion to a hotter substrate raises λ_eff when
/// E_λ &gt; 0 and lowers it when E_λ &lt; 0.
/// </summary>
public static class EffectiveCaptureLength
{
    /// <summary>λ_eff (µm) for total unguarded collection <paramref name="totalIntegralUm2S"/> over <paramref name="seconds"/>; NaN when it lies outside the table.</summary>
    public static double Find(CaptureAreaTable table, ReadOnlySpan<bool> guarded, double totalIntegralUm2S, double seconds)
    {
        ArgumentNullException.ThrowIfNull(table);
        double target = totalIntegralUm2S / seconds;
        double lo = Math.Log(table.LambdaMinUm), hi = Math.Log(table.LambdaMaxUm);
        if (!(target > 0))
        {
            return double.NaN;
        }
        if (target < Total(table, guarded, Math.Exp(lo)) * (1 - 1e-9) || target > Total(table, guarded, Math.Exp(hi)) * (1 + 1e-9))
        {
            return double.NaN;
        }
        for (int i = 0; i < 60; i++)
        {
            double mid = 0.5 * (lo + hi);
            if (Total(table, guarded, Math.Exp(mid)) < target)
            {
                lo = mid;
            }
            else
            {
                hi = mid;
            }
        }
        return Math.Exp(0.5 * (lo + hi));
    }

    /// <summary>Σ over unguarded wires of ∫A dt (µm²·s).</summary>
    public static double UnguardedTotal(ReadOnlySpan<bool> guarded, ReadOnlySpan<double> integralsUm2S)
    {
        double total = 0;
        for (int i = 0; i < guarded.Length; i++)
        {
            total += guarded[i] ? 0 : integralsUm2S[i];
        }
        return total;
    }

    private static double Total(CaptureAreaTable table, ReadOnlySpan<bool> guarded, double lambdaUm)
    {
        double total = 0;
        for (int i = 0; i < table.WireCount; i++)
        {
            total += guarded[i] ? 0 : table.AreaAt(i, lambdaUm);
        }
        return total;
    }
}
