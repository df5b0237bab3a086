using RunWatch.Core.Thermal;
using Xunit;

namespace RunWatch.Core.Tests.Thermal;

public sealed class ArrheniusDiffusivityTests
{
    [Fact]
    public void DiffusivityCmSqPerS_FollowsArrhenius()
    {
        // DERIVED: D = D0·exp(−Ea/(kB·T)).
        var d = new ArrheniusDiffusivity(0.5, 1.2);
        Assert.Equal(0.5 * Math.Exp(-1.2 / (8.617333262145177e-5 * 880)), d.DiffusivityCmSqPerS(880), 1e-20);
    }

    [Fact]
    public void TemperatureForDiffusivityK_InvertsDiffusivity()
    {
        var d = new ArrheniusDiffusivity(0.5, 1.2);
        Assert.Equal(880.0, d.TemperatureForDiffusivityK(d.DiffusivityCmSqPerS(880)), 1e-9);
        Assert.Throws<ArgumentOutOfRangeException>(() => d.TemperatureForDiffusivityK(0.6));
        Assert.Throws<ArgumentOutOfRangeException>(() => d.TemperatureForDiffusivityK(0));
    }

    [Fact]
    public void FromReference_ReproducesTheReferencePoint()
    {
        var d = ArrheniusDiffusivity.FromReference(3e-10, 773.15, 1.4);
        Assert.Equal(3e-10, d.DiffusivityCmSqPerS(773.15), 3e-10 * 1e-13);
        Assert.Equal(1.4, d.EaEv);
    }

    [Theory]
    [InlineData(0.0, 1.0)]
    [InlineData(-1.0, 1.0)]
    [InlineData(double.NaN, 1.0)]
    [InlineData(1.0, -0.1)]
    [InlineData(1.0, double.PositiveInfinity)]
    public void Validate_BadParameters_AreReported(double d0, double ea)
    {
        Assert.NotEmpty(new ArrheniusDiffusivity(d0, ea).Validate());
    }

    [Fact]
    public void Validate_GoodParameters_AreAccepted()
    {
        Assert.Empty(new ArrheniusDiffusivity(1e-3, 1.1).Validate());
        Assert.Empty(new LifetimeModel(1e-12, 2.0).Validate());
        Assert.NotEmpty(new LifetimeModel(0, 2.0).Validate());
        Assert.NotEmpty(new LifetimeModel(1e-12, -1).Validate());
    }
}
