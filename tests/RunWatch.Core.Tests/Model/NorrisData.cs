namespace RunWatch.Core.Tests.Model;

/// <summary>
/// NIST StRD linear regression dataset "Norris" (Norris, J., NIST, "Calibration of Ozone Monitors"), model
/// y = B0 + B1·x, 36 observations. CONFIRMED (secondary): certified values as copied from NIST's Norris.dat in the
/// GSL test suite fit/test.c; listed in the project's check-value notes, where an exact rational recomputation
/// agrees with every certified digit.
/// </summary>
internal static class NorrisData
{
    public const double B0 = -0.262323073774029;
    public const double SdB0 = 0.232818234301152;
    public const double B1 = 1.00211681802045;
    public const double SdB1 = 0.429796848199937E-03;
    public const double ResidualSd = 0.884796396144373;
    public const double RSquared = 0.999993745883712;
    public const double ResidualSumOfSquares = 26.6173985294224;

    // (y, x) pairs in file order.
    private static readonly double[] Pairs =
    [
        0.1, 0.2, 338.8, 337.4, 118.1, 118.2, 888.0, 884.6, 9.2, 10.1, 228.1, 226.5, 668.5, 666.3, 998.5, 996.3,
        449.1, 448.6, 778.9, 777.0, 559.2, 558.2, 0.3, 0.4, 0.1, 0.6, 778.1, 775.5, 668.8, 666.9, 339.3, 338.0,
        448.9, 447.5, 10.8, 11.6, 557.7, 556.0, 228.3, 228.1, 998.0, 995.8, 888.8, 887.6, 119.6, 120.2, 0.3, 0.3,
        0.6, 0.3, 557.6, 556.8, 339.3, 339.1, 888.0, 887.2, 998.5, 999.0, 778.9, 779.0, 10.2, 11.1, 117.6, 118.3,
        228.9, 229.2, 668.4, 669.1, 449.2, 448.9, 0.2, 0.5,
    ];

    public static double[] X => Enumerable.Range(0, Pairs.Length / 2).Select(i => Pairs[(2 * i) + 1]).ToArray();

    public static double[] Y => Enumerable.Range(0, Pairs.Length / 2).Select(i => Pairs[2 * i]).ToArray();
}
