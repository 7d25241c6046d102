namespace SoftSensor.Daemon.Access;

/// <summary>
/// Request-body limits per endpoint, applied before anything reads the body: a declared
/// Content-Length above the limit answers 413 at once, a chunked body is cut by the server at the
/// limit (also 413). Commands and samples are a few hundred bytes; the limits leave room, no more.
/// </summary>
internal static class RequestLimits
{
    /// <summary>Batch and alarm commands, samples (JSON), the login form.</summary>
    public const long CommandBytes = 4 * 1024;

    /// <summary>The batch and sample forms (URL-encoded, with the anti-forgery field).</summary>
    public const long FormBytes = 8 * 1024;

    /// <summary>Anything else (reads carry no body).</summary>
    public const long OtherBytes = 1024;

    /// <summary>The server-wide ceiling (Kestrel), above every per-endpoint limit.</summary>
    public const long ServerBytes = 64 * 1024;

    /// <summary>Request headers in total (Kestrel; its default is 32 KiB).</summary>
    public const int HeaderBytes = 16 * 1024;

    /// <summary>Number of request headers (Kestrel; its default is 100).</summary>
    public const int HeaderCount = 40;

    public static long For(string method, string path)
    {
        if (HttpMethodsEx.IsRead(method))
        {
            return OtherBytes;
        }

        if (path.StartsWith("/api/", StringComparison.Ordinal) || path == "/login" || path == "/logout")
        {
            return CommandBytes;
        }

        return path.StartsWith("/batches/", StringComparison.Ordinal) || path.StartsWith("/samples/", StringComparison.Ordinal) ? FormBytes : OtherBytes;
    }
}

/// <summary>Which HTTP methods only read.</summary>
internal static class HttpMethodsEx
{
    public static bool IsRead(string method) =>
        Microsoft.AspNetCore.Http.HttpMethods.IsGet(method) || Microsoft.AspNetCore.Http.HttpMethods.IsHead(method) || Microsoft.AspNetCore.Http.HttpMethods.IsOptions(method);
}
