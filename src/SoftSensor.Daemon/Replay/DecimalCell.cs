using System.Globalization;

namespace SoftSensor.Daemon.Replay;

/// <summary>
/// Parses a CSV cell as a double, giving exactly what <see cref="double.TryParse(ReadOnlySpan{char}, NumberStyles, IFormatProvider?, out double)"/>
/// gives with <see cref="NumberStyles.Float"/> and the invariant culture. The common cell, an optional
/// sign, at most 15 digits and an optional point (e.g. <c>-20.89594</c>), takes a fast path: the digits
/// as an integer m &lt; 10^15 &lt; 2^53 and the decimals d &lt;= 22 are both exact doubles, so m / 10^d
/// is one correctly rounded IEEE 754 division, which is the correctly rounded value of the decimal
/// (Clinger 1990, "How to read floating point numbers accurately", PLDI '90, the fast path of
/// section 4). Everything else (exponents, more digits, NaN, spaces) goes to the framework parser.
/// </summary>
internal static class DecimalCell
{
    private const int MaxFastDigits = 15;

    // Exact powers of ten: 10^22 is the largest that a double holds exactly.
    private static readonly double[] Powers =
    [
        1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22,
    ];

    public static bool TryParse(ReadOnlySpan<char> cell, out double value)
    {
        if (TryFast(cell, out value))
        {
            return true;
        }

        return double.TryParse(cell, NumberStyles.Float, CultureInfo.InvariantCulture, out value);
    }

    private static bool TryFast(ReadOnlySpan<char> c, out double value)
    {
        value = 0;
        int i = 0;
        bool negative = false;
        if (c.Length > 0 && (c[0] == '-' || c[0] == '+'))
        {
            negative = c[0] == '-';
            i = 1;
        }

        long mantissa = 0;
        int digits = 0, decimals = 0;
        bool point = false;
        for (; i < c.Length; i++)
        {
            int d = c[i] - '0';
            if ((uint)d <= 9)
            {
                if (++digits > MaxFastDigits)
                {
                    return false;
                }

                mantissa = (mantissa * 10) + d;
                if (point)
                {
                    decimals++;
                }
            }
            else if (c[i] == '.' && !point)
            {
                point = true;
            }
            else
            {
                return false;
            }
        }

        if (digits == 0)
        {
            return false;
        }

        double v = mantissa / Powers[decimals];
        value = negative ? -v : v;
        return true;
    }
}
