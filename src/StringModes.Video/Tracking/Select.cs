namespace StringModes.Video.Tracking;

/// <summary>In-place selection (Hoare's quickselect, CACM 4:321, 1961) for medians without sorting or allocating.</summary>
internal static class Select
{
    public static float Median(Span<float> v)
    {
        int k = v.Length / 2;
        int lo = 0, hi = v.Length - 1;
        while (lo < hi)
        {
            float pivot = v[(lo + hi) >> 1];
            int i = lo, j = hi;
            while (i <= j)
            {
                while (v[i] < pivot) i++;
                while (v[j] > pivot) j--;
                if (i <= j)
                {
                    (v[i], v[j]) = (v[j], v[i]);
                    i++;
                    j--;
                }
            }

            if (k <= j)
            {
                hi = j;
            }
            else if (k >= i)
            {
                lo = i;
            }
            else
            {
                break;
            }
        }

        return v[k];
    }
}
