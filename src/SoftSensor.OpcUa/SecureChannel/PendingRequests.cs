using System.Collections.Concurrent;
using SoftSensor.OpcUa.Services;

namespace SoftSensor.OpcUa.SecureChannel;

/// <summary>
/// Requests waiting for their response, keyed by RequestId (Part 6 §6.7.2.4: the response
/// carries the RequestId of its request). Thread-safe.
/// </summary>
internal sealed class PendingRequests
{
    private readonly ConcurrentDictionary<uint, TaskCompletionSource<IServiceResponse>> waiting = new();
    private int lastId;

    /// <summary>Takes a new RequestId and registers a waiter for it.</summary>
    public (uint RequestId, TaskCompletionSource<IServiceResponse> Waiter) Register()
    {
        uint id = unchecked((uint)Interlocked.Increment(ref lastId));
        if (id == 0)
        {
            id = unchecked((uint)Interlocked.Increment(ref lastId));
        }

        var waiter = new TaskCompletionSource<IServiceResponse>(TaskCreationOptions.RunContinuationsAsynchronously);
        waiting[id] = waiter;
        return (id, waiter);
    }

    /// <summary>Completes the waiter of a request; false when nobody waits any more.</summary>
    public bool Complete(uint requestId, IServiceResponse response) =>
        waiting.TryRemove(requestId, out var waiter) && waiter.TrySetResult(response);

    /// <summary>Fails the waiter of one request; false when nobody waits any more.</summary>
    public bool Fail(uint requestId, Exception error) =>
        waiting.TryRemove(requestId, out var waiter) && waiter.TrySetException(error);

    /// <summary>Forgets a request whose caller gave up.</summary>
    public void Forget(uint requestId) => waiting.TryRemove(requestId, out _);

    /// <summary>Fails every waiter (the channel is gone).</summary>
    public void FailAll(Func<Exception> error)
    {
        foreach (var id in waiting.Keys)
        {
            Fail(id, error());
        }
    }

    public int Count => waiting.Count;
}
