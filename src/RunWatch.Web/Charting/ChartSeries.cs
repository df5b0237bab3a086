namespace RunWatch.Web.Charting;

/// <summary>A series ready for plotly: local-time x strings and values; <see cref="SourcePoints"/> counts the samples it stands for.</summary>
public sealed record ChartSeries(List<object> X, List<object> Y, int SourcePoints)
{
    public int Points => X.Count;
}
