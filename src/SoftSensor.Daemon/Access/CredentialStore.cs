using System.Collections.Concurrent;
using System.Security.Cryptography;
using System.Text;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using SoftSensor.Daemon.Configuration;

namespace SoftSensor.Daemon.Access;

/// <summary>Who a request is: the authenticated name and role.</summary>
internal sealed record Principal(string Name, Role Role, string Method);

/// <summary>
/// The credentials the daemon checks, read from the credentials file and read again when the file
/// changes (checked at most once a second), plus one-time tokens made in memory (the demo's login
/// link). Thread-safe.
/// </summary>
internal sealed class CredentialStore
{
    private readonly string _path;
    private readonly TimeProvider _time;
    private readonly ILogger<CredentialStore> _log;
    private readonly Lock _gate = new();
    private readonly ConcurrentDictionary<string, Role> _oneTime = new(StringComparer.Ordinal);
    private IReadOnlyList<Credential> _entries = [];
    private DateTime _stamp = DateTime.MinValue;
    private long _checkedMs = long.MinValue;

    public CredentialStore(IOptions<SoftSensorOptions> options, TimeProvider time, ILogger<CredentialStore> log)
    {
        _path = System.IO.Path.GetFullPath(options.Value.Access.CredentialsFile);
        _time = time;
        _log = log;
        Reload(force: true);
        if (_entries.Count == 0)
        {
            AccessLog.NoCredentials(_log, _path);
        }
    }

    /// <summary>The file read.</summary>
    public string FilePath => _path;

    /// <summary>The user whose password matches, or null.</summary>
    public Principal? CheckPassword(string name, string password)
    {
        Reload(force: false);
        var e = _entries.FirstOrDefault(c => c.Kind == CredentialKind.User && c.Name == name);
        // A missing user costs a hash too, so the answer time does not tell which names exist.
        bool ok = PasswordHash.Verify(password, e?.Hash ?? Decoy.Value) && e is not null;
        return ok ? new Principal(e!.Name, e.Role, "password") : null;
    }

    /// <summary>The token's owner, or null.</summary>
    public Principal? CheckToken(string token)
    {
        Reload(force: false);
        byte[] presented = Encoding.ASCII.GetBytes(PasswordHash.TokenHash(token));
        foreach (var e in _entries)
        {
            if (e.Kind == CredentialKind.Token && CryptographicOperations.FixedTimeEquals(presented, Encoding.ASCII.GetBytes(e.Hash)))
            {
                return new Principal(e.Name, e.Role, "token");
            }
        }

        return null;
    }

    /// <summary>A token usable once (to open a login session), held in memory only.</summary>
    public string AddOneTimeToken(Role role)
    {
        var (token, hash) = PasswordHash.NewToken();
        _oneTime[hash] = role;
        return token;
    }

    /// <summary>Consumes a one-time token: its role once, then never again.</summary>
    public Role? UseOneTimeToken(string token) => _oneTime.TryRemove(PasswordHash.TokenHash(token), out var role) ? role : null;

    private static readonly Lazy<string> Decoy = new(() => PasswordHash.Hash("decoy", PasswordHash.DefaultIterations));

    private void Reload(bool force)
    {
        long now = _time.GetTimestamp() * 1000 / _time.TimestampFrequency;
        lock (_gate)
        {
            if (!force && now - _checkedMs < 1000)
            {
                return;
            }

            _checkedMs = now;
            var stamp = File.Exists(_path) ? File.GetLastWriteTimeUtc(_path) : DateTime.MinValue;
            if (!force && stamp == _stamp)
            {
                return;
            }

            _stamp = stamp;
            var (entries, problems) = CredentialFile.Read(_path);
            if (problems.Count > 0)
            {
                AccessLog.BadCredentials(_log, _path, string.Join(" | ", problems));
                _entries = [];
                return;
            }

            if (!OperatingSystem.IsWindows() && File.Exists(_path) && (File.GetUnixFileMode(_path) & (UnixFileMode.GroupRead | UnixFileMode.OtherRead | UnixFileMode.GroupWrite | UnixFileMode.OtherWrite)) != 0)
            {
                AccessLog.OpenPermissions(_log, _path);
            }

            _entries = entries;
        }
    }
}
