using RunWatch.Core.Thermal;
using RunWatch.Thermal;
using Xunit;

namespace RunWatch.Tests.Thermal;

public sealed class ThermalCsvReaderTests
{
    [Fact]
    public void Read_SecondsWithEmptyCells_SkipsMissingSamples()
    {
        ThermalCsv csv = ThermalCsvReader.Read(new StringReader("# comment\n\ntime,tc,sp\n0,600.5,610\n0.5,,\n1,601,\n"));
        Assert.Equal(["tc", "sp"], csv.Channels);
        Assert.Null(csv.Origin);
        ThermalRecord tc = csv.Record("tc");
        Assert.Equal([0.0, 1.0], tc.TimesS.ToArray());
        Assert.Equal([600.5, 601.0], tc.ReadingsC.ToArray());
        Assert.Single(csv.Record("sp").TimesS.ToArray());
    }

    [Fact]
    public void Read_IsoTimesWithOffsets_AreSecondsFromFirstRow()
    {
        ThermalCsv csv = ThermalCsvReader.Read(new StringReader("\"t\",\"tc\"\n2026-03-04T10:00:00.125Z,600\n2026-03-04T11:00:01.125+01:00,601\n"));
        Assert.Equal(new DateTimeOffset(2026, 3, 4, 10, 0, 0, 125, TimeSpan.Zero), csv.Origin);
        Assert.Equal([0.0, 1.0], csv.Record("tc").TimesS.ToArray());
    }

    [Fact]
    public void Read_MixedTimeForms_Throws()
    {
        var ex = Assert.Throws<ThermalCsvException>(() => ThermalCsvReader.Read(new StringReader("t,tc\n0,600\n2026-03-04T10:00:00Z,600\n")));
        Assert.Equal(3, ex.Line);
        Assert.Equal(1, ex.Column);
    }

    [Theory]
    [InlineData("t,tc,tc\n0,1,2\n", 1, 3)]
    [InlineData("t,,x\n0,1,2\n", 1, 2)]
    [InlineData("t,tc\n0,NaN\n", 2, 2)]
    [InlineData("t,tc\n0,1e400\n", 2, 2)]
    public void Read_BadCells_NameLineAndColumn(string text, int line, int column)
    {
        var ex = Assert.Throws<ThermalCsvException>(() => ThermalCsvReader.Read(new StringReader(text)));
        Assert.Equal(line, ex.Line);
        Assert.Equal(column, ex.Column);
    }
}
