using System.Runtime.InteropServices;

namespace RunWatch.Benchmarks;

/// <summary>
/// CPU time of the calling thread (Linux CLOCK_THREAD_CPUTIME_ID). On a shared, loaded machine wall time mostly
/// measures the other processes; thread CPU time measures the work on one core.
/// </summary>
internal static class ThreadCpuClock
{
    private const int ClockThreadCpuTimeId = 3;

    /// <summary>Nanoseconds of CPU time used by this thread, or NaN where the clock is unavailable.</summary>
    public static double NowNs()
    {
        if (!OperatingSystem.IsLinux())
        {
            return double.NaN;
        }
        return ClockGetTime(ClockThreadCpuTimeId, out Timespec ts) == 0 ? ts.Seconds * 1e9 + ts.Nanoseconds : double.NaN;
    }

    // DllImport rather than LibraryImport: the struct is blittable and the benchmark project compiles without /unsafe.
    [DllImport("libc", EntryPoint = "clock_gettime")]
    private static extern int ClockGetTime(int clockId, out Timespec time);

    [StructLayout(LayoutKind.Sequential)]
    private struct Timespec
    {
        public long Seconds;
        public long Nanoseconds;
    }
}
