using System.Collections.Concurrent;
using System.Security.Cryptography;
using System.Text;
using Microsoft.Extensions.Options;
using SoftSensor.Daemon.Configuration;

namespace SoftSensor.Daemon.Access;

/// <summary>A login session: its owner, its anti-forgery token (the synchronizer token of every form) and when it was last used.</summary>
internal sealed class Session(string id, Principal principal, string antiForgery, DateTimeOffset lastUsed)
{
    public string Id { get; } = id;

    public Principal Principal { get; } = principal;

    public string AntiForgery { get; } = antiForgery;

    public DateTimeOffset LastUsed { get; set; } = lastUsed;

    /// <summary>Whether <paramref name="presented"/> is this session's anti-forgery token (constant time).</summary>
    public bool AntiForgeryMatches(string? presented) =>
        presented is not null && CryptographicOperations.FixedTimeEquals(Encoding.ASCII.GetBytes(presented), Encoding.ASCII.GetBytes(AntiForgery));
}

/// <summary>
/// Login sessions in memory (a restart logs everyone out), keyed by a 256-bit random id sent as an
/// HttpOnly, SameSite=Strict cookie; a session unused for <see cref="AccessOptions.SessionIdleTimeout"/>
/// ends. Thread-safe.
/// </summary>
internal sealed class SessionStore(IOptions<SoftSensorOptions> options, TimeProvider time)
{
    public const string CookieName = "softsensor_session";

    private const int MaxSessions = 1000;

    private readonly ConcurrentDictionary<string, Session> _sessions = new(StringComparer.Ordinal);

    public Session Open(Principal principal)
    {
        var now = time.GetUtcNow();
        if (_sessions.Count >= MaxSessions)
        {
            foreach (var old in _sessions.Values.OrderBy(s => s.LastUsed).Take(_sessions.Count - MaxSessions + 1))
            {
                _sessions.TryRemove(old.Id, out _);
            }
        }

        var s = new Session(PasswordHash.RandomId(), principal, PasswordHash.RandomId(), now);
        _sessions[s.Id] = s;
        return s;
    }

    /// <summary>The live session of a cookie value, or null (an expired one is removed).</summary>
    public Session? Find(string? id)
    {
        if (id is null || !_sessions.TryGetValue(id, out var s))
        {
            return null;
        }

        var now = time.GetUtcNow();
        if (now - s.LastUsed > options.Value.Access.SessionIdleTimeout)
        {
            _sessions.TryRemove(id, out _);
            return null;
        }

        s.LastUsed = now;
        return s;
    }

    public void Close(string id) => _sessions.TryRemove(id, out _);
}
