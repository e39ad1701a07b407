using StringModes.Shared;

namespace StringModes.Reporting.Tests.Files;

public sealed class AtomicFileTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("stringmodes-atomic-").FullName;

    [Fact]
    public void Write_ReplacesExistingContentAndLeavesNoTemporaryFile()
    {
        var path = Path.Combine(_dir, "report.html");
        AtomicFile.WriteAllText(path, "first");
        AtomicFile.WriteAllText(path, "second ± µ");
        Assert.Equal("second ± µ", File.ReadAllText(path));
        Assert.Equal([path], Directory.GetFiles(_dir));
        // UTF-8 without byte-order mark.
        Assert.NotEqual(0xEF, File.ReadAllBytes(path)[0]);
    }

    [Fact]
    public void MissingFolder_ThrowsAndWritesNothing()
    {
        var path = Path.Combine(_dir, "absent", "x.png");
        Assert.Throws<DirectoryNotFoundException>(() => AtomicFile.WriteAllBytes(path, [1, 2, 3]));
        Assert.Empty(Directory.GetFileSystemEntries(_dir));
    }

    public void Dispose() => Directory.Delete(_dir, recursive: true);
}
