namespace SoftSensor.OpcUa.Session;

/// <summary>Who the session acts for (Part 4 §5.6.3: the user identity token of ActivateSession).</summary>
public abstract record UserIdentity
{
    public static UserIdentity Anonymous { get; } = new AnonymousIdentity();

    public static UserIdentity UserName(string user, string password) => new UserNameIdentity(user, password);
}

/// <summary>No user: the AnonymousIdentityToken.</summary>
public sealed record AnonymousIdentity : UserIdentity;

/// <summary>A user name and password; <see cref="ToString"/> never shows the password.</summary>
public sealed record UserNameIdentity(string User, string Password) : UserIdentity
{
    public override string ToString() => $"UserNameIdentity {{ User = {User} }}";
}
