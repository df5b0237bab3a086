using RunWatch.Core.Thermal;
using Xunit;

namespace RunWatch.Core.Tests.Thermal;

public sealed class ThermalRecordTests
{
    [Fact]
    public void Constructor_CopiesSamples()
    {
        double[] t = [0, 1, 1, 2];
        double[] r = [600, 601, 605, 604];
        var record = new ThermalRecord("substrate_tc", t, r);
        t[0] = 99;
        Assert.Equal(4, record.Count);
        Assert.Equal(0, record.TimesS[0]);
        Assert.Equal("substrate_tc", record.Channel);
    }

    [Fact]
    public void Constructor_BadSamples_Throw()
    {
        Assert.Throws<ArgumentException>(() => new ThermalRecord("tc", [0.0, 2, 1], [1.0, 2, 3]));
        Assert.Throws<ArgumentException>(() => new ThermalRecord("tc", [0.0, 1], [1.0]));
        Assert.Throws<ArgumentException>(() => new ThermalRecord("tc", [0.0, 1], [1.0, double.NaN]));
    }
}
