namespace RunWatch.Web.Data;

/// <summary>A fitted radius model: linear r = A + B·Â or power law r = A·Â^B, radius in nm.</summary>
public sealed record RadiusFit(RadiusModelForm Form, double A, double B, double RSquared, double RmseNm, int Points, DateTimeOffset FittedAt);
