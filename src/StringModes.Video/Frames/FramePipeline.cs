using System.Collections.Concurrent;
using OpenCvSharp;

namespace StringModes.Video.Frames;

/// <summary>
/// Decodes a frame source on its own thread, a few frames ahead of the consumer, so that decoding and per-frame work
/// overlap on a multi-core machine. Frames live in a small pool of buffers that are reused (no per-frame
/// allocation); a frame handed to the consumer stays valid until the consumer asks for the next one. Errors of the
/// decoding thread are rethrown to the consumer.
/// </summary>
public sealed class FramePipeline : IDisposable
{
    private readonly IFrameSource _source;
    private readonly BlockingCollection<Mat> _free;
    private readonly BlockingCollection<(Mat Frame, double TimestampS)> _decoded;
    private readonly List<Mat> _buffers = [];
    private readonly CancellationTokenSource _stop;
    private readonly Task _decoder;
    private Exception? _failure;

    /// <summary>Starts decoding <paramref name="source"/> with <paramref name="depth"/> frames in flight (at least 2).</summary>
    public FramePipeline(IFrameSource source, int depth = 4, CancellationToken cancel = default)
    {
        _source = source;
        depth = Math.Max(2, depth);
        _free = new BlockingCollection<Mat>(depth);
        _decoded = new BlockingCollection<(Mat, double)>(depth);
        for (var i = 0; i < depth; i++)
        {
            var m = new Mat();
            _buffers.Add(m);
            _free.Add(m);
        }
        _stop = CancellationTokenSource.CreateLinkedTokenSource(cancel);
        _decoder = Task.Factory.StartNew(Decode, CancellationToken.None, TaskCreationOptions.LongRunning, TaskScheduler.Default);
    }

    private void Decode()
    {
        try
        {
            while (!_stop.IsCancellationRequested)
            {
                var buffer = _free.Take(_stop.Token);
                if (!_source.ReadInto(buffer, out var timestamp)) break;
                _decoded.Add((buffer, timestamp), _stop.Token);
            }
        }
        catch (OperationCanceledException) { }
        catch (Exception e) { _failure = e; }
        finally { _decoded.CompleteAdding(); }
    }

    /// <summary>The frames in order with their timestamps. Throws the decoding thread's error, or <see cref="OperationCanceledException"/> when cancelled.</summary>
    public IEnumerable<(Mat Frame, double TimestampS)> Frames()
    {
        Mat? lent = null;
        foreach (var item in _decoded.GetConsumingEnumerable())
        {
            if (lent is not null) _free.Add(lent);
            lent = item.Frame;
            yield return item;
        }
        if (lent is not null) _free.Add(lent);
        _stop.Token.ThrowIfCancellationRequested();
        if (_failure is not null) System.Runtime.ExceptionServices.ExceptionDispatchInfo.Capture(_failure).Throw();
    }

    /// <summary>Stops decoding, waits for the decoding thread and frees the buffers.</summary>
    public void Dispose()
    {
        _stop.Cancel();
        try { _decoder.Wait(); } catch (AggregateException) { }
        foreach (var m in _buffers) m.Dispose();
        _stop.Dispose();
        _free.Dispose();
        _decoded.Dispose();
    }
}
