using System.Globalization;

namespace SoftSensor.Core.Chemistry;

/// <summary>
/// Reads formulas of the form (Element [number])+ [charge], where number is a decimal with '.'
/// ("CH1.8O0.5N0.2") and charge is '+' or '-' with an optional number ("NH4+", "HPO4-2").
/// An element may repeat ("C2H5OH"). Whitespace is not allowed inside a formula.
/// </summary>
internal static class FormulaParser
{
    public static Formula Parse(string text)
    {
        if (!TryParseCore(text, out var formula, out int pos, out string? reason))
        {
            throw new FormulaFormatException(text ?? string.Empty, pos, reason!);
        }

        return formula!;
    }

    public static bool TryParse(string text, out Formula? formula, out string? error)
    {
        if (TryParseCore(text, out formula, out int pos, out string? reason))
        {
            error = null;
            return true;
        }

        error = new FormulaFormatException(text ?? string.Empty, pos, reason!).Message;
        return false;
    }

    private static bool TryParseCore(string? text, out Formula? formula, out int position, out string? reason)
    {
        formula = null;
        position = 0;
        if (string.IsNullOrEmpty(text))
        {
            reason = "empty formula";
            return false;
        }

        var counts = new double[Elements.Count];
        double charge = 0;
        int i = 0;
        bool anyElement = false;
        while (i < text.Length)
        {
            char ch = text[i];
            if (ch is '+' or '-')
            {
                if (!anyElement)
                {
                    position = i;
                    reason = "a charge needs elements before it";
                    return false;
                }

                int signAt = i;
                i++;
                double magnitude = 1;
                if (i < text.Length)
                {
                    if (!TryReadNumber(text, ref i, out magnitude, out position, out reason))
                    {
                        return false;
                    }
                }

                if (i != text.Length)
                {
                    position = i;
                    reason = "nothing may follow the charge";
                    return false;
                }

                charge = ch == '+' ? magnitude : -magnitude;
                _ = signAt;
                break;
            }

            if (!char.IsAsciiLetterUpper(ch))
            {
                position = i;
                reason = char.IsAsciiLetterLower(ch)
                    ? $"element symbols start with a capital letter, found '{ch}'"
                    : $"unexpected character '{ch}'";
                return false;
            }

            int start = i;
            i++;
            while (i < text.Length && char.IsAsciiLetterLower(text[i]))
            {
                i++;
            }

            string symbol = text[start..i];
            if (!Elements.TryParse(symbol, out var element))
            {
                position = start;
                reason = $"unknown element '{symbol}' (allowed: C H O N S P)";
                return false;
            }

            double n = 1;
            if (i < text.Length && (char.IsAsciiDigit(text[i]) || text[i] == '.'))
            {
                if (!TryReadNumber(text, ref i, out n, out position, out reason))
                {
                    return false;
                }

                if (n <= 0)
                {
                    position = start;
                    reason = $"subscript of {symbol} must be positive";
                    return false;
                }
            }

            counts[(int)element] += n;
            anyElement = true;
        }

        formula = new Formula(counts, charge, text);
        reason = null;
        return true;
    }

    private static bool TryReadNumber(string text, ref int i, out double value, out int position, out string? reason)
    {
        int start = i;
        bool dot = false;
        while (i < text.Length && (char.IsAsciiDigit(text[i]) || (text[i] == '.' && !dot)))
        {
            dot |= text[i] == '.';
            i++;
        }

        string s = text[start..i];
        if (s.Length == 0 || s == "." || s.EndsWith('.') || !double.TryParse(s, NumberStyles.AllowDecimalPoint, CultureInfo.InvariantCulture, out value))
        {
            value = 0;
            position = s.Length == 0 ? start : i - 1;
            reason = s.Length == 0 ? $"expected a number, found '{(start < text.Length ? text[start] : ' ')}'" : $"malformed number '{s}'";
            return false;
        }

        position = 0;
        reason = null;
        return true;
    }
}
