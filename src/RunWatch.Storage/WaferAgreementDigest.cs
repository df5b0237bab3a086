namespace RunWatch.Storage;

/// <summary>How the wafer's predicted radii agreed with the measured ones (part of <see cref="WaferReportDigest"/>).</summary>
/// <param name="Count">Wires compared.</param>
/// <param name="BiasNm">Mean predicted − measured, nm.</param>
/// <param name="RmseNm">Root-mean-square error, nm.</param>
/// <param name="RSquared">Coefficient of determination of measured by predicted.</param>
/// <param name="MeanAbsoluteErrorNm">Mean |predicted − measured|, nm.</param>
public sealed record WaferAgreementDigest(int Count, double BiasNm, double RmseNm, double RSquared, double MeanAbsoluteErrorNm);
