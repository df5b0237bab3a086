namespace RunWatch.Core.Model;

/// <summary>Ordinary least-squares straight line y = Intercept + Slope·x with its standard errors.</summary>
internal readonly record struct LineFit(
    int Count,
    double Intercept,
    double Slope,
    double InterceptStandardError,
    double SlopeStandardError,
    double ResidualSumOfSquares,
    double TotalSumOfSquares,
    double ResidualStandardError,
    double RSquared,
    double MeanX,
    double SumSquaresX);
