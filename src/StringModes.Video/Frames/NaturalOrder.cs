namespace StringModes.Video.Frames;

/// <summary>Orders file names with embedded numbers by value ("f2" before "f10"), case-insensitively otherwise.</summary>
internal sealed class NaturalOrder : IComparer<string>
{
    public static readonly NaturalOrder Instance = new();

    public int Compare(string? a, string? b)
    {
        if (a is null || b is null)
        {
            return string.CompareOrdinal(a, b);
        }

        int i = 0, j = 0;
        while (i < a.Length && j < b.Length)
        {
            if (char.IsAsciiDigit(a[i]) && char.IsAsciiDigit(b[j]))
            {
                int si = i, sj = j;
                while (i < a.Length && char.IsAsciiDigit(a[i])) i++;
                while (j < b.Length && char.IsAsciiDigit(b[j])) j++;
                var da = a.AsSpan(si, i - si).TrimStart('0');
                var db = b.AsSpan(sj, j - sj).TrimStart('0');
                if (da.Length != db.Length)
                {
                    return da.Length.CompareTo(db.Length);
                }

                int c = da.SequenceCompareTo(db);
                if (c != 0)
                {
                    return c;
                }
            }
            else
            {
                int c = char.ToLowerInvariant(a[i]).CompareTo(char.ToLowerInvariant(b[j]));
                if (c != 0)
                {
                    return c;
                }

                i++;
                j++;
            }
        }

        int rest = (a.Length - i).CompareTo(b.Length - j);
        return rest != 0 ? rest : string.CompareOrdinal(a, b);
    }
}
