using RunWatch.Core.ControlCharts;
using Xunit;

namespace RunWatch.Core.Tests.ControlCharts;

/// <summary>
/// Western Electric run rules: worked sequences whose signals are known by construction, and in-control false-alarm
/// rates against closed forms for normally distributed data.
/// </summary>
public sealed class WesternElectricRulesTests
{
    private static List<RunRuleSignal> Signals(params double[] z) => [.. WesternElectricRules.Evaluate(z, 0, 1)];

    [Fact]
    public void Evaluate_OnePointBeyondThreeSigma_Rule1AtThatPoint()
    {
        Assert.Equal([new RunRuleSignal(1, RunRule.OneBeyondThreeSigma)], Signals(0, 3.5, 0));
        Assert.Equal([new RunRuleSignal(1, RunRule.OneBeyondThreeSigma)], Signals(0, -3.01, 0));
        Assert.Empty(Signals(0, 3.0, 0)); // "beyond": exactly on the limit is inside
    }

    [Fact]
    public void Evaluate_TwoOfThreeBeyondTwoSigmaSameSide_Rule2WhereCompleted()
    {
        Assert.Equal([new RunRuleSignal(3, RunRule.TwoOfThreeBeyondTwoSigma)], Signals(0, 2.5, 0.5, 2.2));
        // Opposite sides do not make a pattern.
        Assert.Empty(Signals(0, 2.5, -2.5, 0));
        // A point on the other side does not complete an earlier side's pattern.
        Assert.Equal([new RunRuleSignal(1, RunRule.TwoOfThreeBeyondTwoSigma)], Signals(2.5, 2.5, -2.5));
    }

    [Fact]
    public void Evaluate_FourOfFiveBeyondOneSigma_Rule3()
    {
        Assert.Equal([new RunRuleSignal(4, RunRule.FourOfFiveBeyondOneSigma)], Signals(1.5, 1.5, 0, 1.5, 1.5));
        Assert.Empty(Signals(1.5, 1.5, 0, 0, 1.5));
    }

    [Fact]
    public void Evaluate_EightOnOneSide_Rule4AtEighthAndAfter_NaNSkipped()
    {
        double[] nine = [0.5, 0.5, 0.5, 0.5, 0.5, 0.5, 0.5, 0.5, 0.5];
        Assert.Equal([new RunRuleSignal(7, RunRule.EightOnOneSide), new RunRuleSignal(8, RunRule.EightOnOneSide)], Signals(nine));
        // A missing value neither breaks nor completes the run: the eighth finite point completes it.
        double[] gap = [-0.2, -0.2, -0.2, double.NaN, -0.2, -0.2, -0.2, -0.2, -0.2];
        Assert.Equal([new RunRuleSignal(8, RunRule.EightOnOneSide)], Signals(gap));
        Assert.Empty(Signals(0.5, 0.5, 0.5, 0, 0.5, 0.5, 0.5, 0.5));
    }

    [Fact]
    public void Evaluate_InControlNormalData_FalseAlarmRatesMatchClosedForms()
    {
        // 400 000 standard normal values (Box–Muller, seeded).
        var random = new Random(1956);
        var values = new double[400_000];
        for (int i = 0; i < values.Length; i += 2)
        {
            double u1 = 1 - random.NextDouble(), u2 = random.NextDouble();
            double r = Math.Sqrt(-2 * Math.Log(u1));
            values[i] = r * Math.Cos(2 * Math.PI * u2);
            values[i + 1] = r * Math.Sin(2 * Math.PI * u2);
        }
        // Shift and scale: the rules must judge against the baseline's centre and σ.
        var shifted = values.Select(v => 30 + (2.5 * v)).ToArray();

        var signals = WesternElectricRules.Evaluate(shifted, 30, 2.5);

        double n = values.Length;
        double rule1 = signals.Count(s => s.Rule == RunRule.OneBeyondThreeSigma) / n;
        double rule4 = signals.Count(s => s.Rule == RunRule.EightOnOneSide) / n;
        // P(|Z| > 3) = 2·(1 − Φ(3)) = 0.0026998 (standard normal table, COMMON PRACTICE); binomial SD √(p(1−p)/n) = 8.2e-5.
        Assert.InRange(rule1, 0.0026998 - (4 * 8.2e-5), 0.0026998 + (4 * 8.2e-5));
        // DERIVED: the eight points ending at a given index are all on one side with probability 2·0.5⁸ = 0.0078125;
        // consecutive windows overlap, so allow a wider band (4 × the SD of independent draws × 3).
        Assert.InRange(rule4, 0.0078125 - 0.0021, 0.0078125 + 0.0021);
    }
}
