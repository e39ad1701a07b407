namespace StringModes.Video.Marks;

/// <summary>Marks ordered along the string; the first and last are the ends.</summary>
/// <param name="Marks">Ordered marks, ends included.</param>
/// <param name="Rejected">Blobs that passed size and shape checks but lie off the string line.</param>
public sealed record MarkLayout(IReadOnlyList<FoundMark> Marks, IReadOnlyList<FoundMark> Rejected)
{
    /// <summary>Number of marks between the ends.</summary>
    public int MovingCount => Math.Max(0, Marks.Count - 2);
}
