using MathNet.Numerics;
using RunWatch.Core.PointPatterns;
using Xunit;

namespace RunWatch.Core.Tests.PointPatterns;

// P_β(s) = a_β s^β exp(−b_β s²) (Einstein, Pimpinelli & González 2014, J. Cryst. Growth 401, 67–71, CONFIRMED); values
// DERIVED in CHECKS.md §4 from the Γ-function formulas; quadrature by MathNet.Numerics (outside reference).
public sealed class WignerSurmiseTests
{
    public static TheoryData<double> Betas => [0.5, 1.0, 2.0, 3.0, 4.0, 5.5, 8.0];

    [Fact]
    public void Coefficients_BetaOne_ArePiOverTwoAndPiOverFour()
    {
        // DERIVED: the Wigner surmise of random-matrix theory, (π/2) s exp(−πs²/4).
        (double a, double b) = WignerSurmise.Coefficients(1.0);
        Assert.Equal(Math.PI / 2, a, 12);
        Assert.Equal(Math.PI / 4, b, 12);
    }

    [Fact]
    public void Coefficients_BetaTwo_Are32OverPiSquaredAndFourOverPi()
    {
        // DERIVED: Γ(2) = 1, Γ(3/2) = √π/2.
        (double a, double b) = WignerSurmise.Coefficients(2.0);
        Assert.Equal(32 / (Math.PI * Math.PI), a, 12);
        Assert.Equal(4 / Math.PI, b, 12);
    }

    [Fact]
    public void Coefficients_BetaFour_MatchGammaFunctionValues()
    {
        // DERIVED: Γ(3) = 2, Γ(5/2) = 3√π/4 ⇒ b = 64/(9π), a = 2·Γ(3)⁵/Γ(5/2)⁶ = 262144/(729π³).
        (double a, double b) = WignerSurmise.Coefficients(4.0);
        Assert.Equal(64 / (9 * Math.PI), b, 12);
        Assert.Equal(262144 / (729 * Math.Pow(Math.PI, 3)), a, 11);
    }

    [Theory]
    [InlineData(3.0, 6.2456090, 1.7671459, 0.1318)]
    [InlineData(4.0, 11.5974571, 2.2635370, 0.1045)]
    [InlineData(5.0, 21.0512203, 2.7611654, 0.0865)]
    public void Coefficients_TabulatedBetas_MatchChecksTable(double beta, double a, double b, double variance)
    {
        // DERIVED values tabulated in CHECKS.md §4 (a and b to 8 significant digits, Var(s) to 4 decimals).
        (double aa, double bb) = WignerSurmise.Coefficients(beta);
        Assert.Equal(a, aa, 6);
        Assert.Equal(b, bb, 6);
        Assert.Equal(variance, WignerSurmise.Variance(beta), 4);
    }

    [Theory]
    [MemberData(nameof(Betas))]
    public void Density_AnyBeta_HasUnitMassAndUnitMean(double beta)
    {
        double mass = Integrate.DoubleExponential(s => WignerSurmise.Density(s, beta), 0, 12, 1e-12);
        double mean = Integrate.DoubleExponential(s => s * WignerSurmise.Density(s, beta), 0, 12, 1e-12);
        Assert.Equal(1.0, mass, 9);
        Assert.Equal(1.0, mean, 9);
    }

    [Theory]
    [MemberData(nameof(Betas))]
    public void Variance_AnyBeta_MatchesQuadrature(double beta)
    {
        // DERIVED: E[s²] = (β+1)/(2b_β) from s² ~ Gamma((β+1)/2, b_β).
        double second = Integrate.DoubleExponential(s => s * s * WignerSurmise.Density(s, beta), 0, 12, 1e-12);
        Assert.Equal(second - 1.0, WignerSurmise.Variance(beta), 9);
    }

    [Theory]
    [InlineData(1.0, 0.7)]
    [InlineData(3.0, 1.3)]
    public void Cdf_MatchesQuadrature(double beta, double s)
    {
        double expected = Integrate.DoubleExponential(t => WignerSurmise.Density(t, beta), 0, s, 1e-12);
        Assert.Equal(expected, WignerSurmise.Cdf(s, beta), 9);
    }

    [Theory]
    [InlineData(1.0)]
    [InlineData(4.0)]
    public void Sample_ManyDraws_MatchMeanAndVariance(double beta)
    {
        // Sampling through MathNet's Gamma sampler; tolerance 5 standard errors of the mean and of the variance.
        var draws = new double[200_000];
        WignerSurmise.Sample(NucleationSites.CreateRandom(17), beta, draws);
        double mean = draws.Average();
        double variance = draws.Sum(v => (v - mean) * (v - mean)) / (draws.Length - 1);
        double v0 = WignerSurmise.Variance(beta);
        Assert.InRange(mean, 1 - (5 * Math.Sqrt(v0 / draws.Length)), 1 + (5 * Math.Sqrt(v0 / draws.Length)));
        Assert.InRange(variance, v0 * (1 - (5 * Math.Sqrt(2.0 / draws.Length) * 1.5)), v0 * (1 + (5 * Math.Sqrt(2.0 / draws.Length) * 1.5)));
    }

    [Fact]
    public void Coefficients_BetaNotAboveMinusOne_Throws()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => WignerSurmise.Coefficients(-1.0));
        Assert.Throws<ArgumentOutOfRangeException>(() => WignerSurmise.Coefficients(double.NaN));
    }
}
