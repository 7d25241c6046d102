namespace SoftSensor.OpcUa.Services;

/// <summary>TimestampsToReturn (Part 4 §7.40).</summary>
public enum TimestampsToReturn
{
    Source = 0,
    Server = 1,
    Both = 2,
    Neither = 3,
}

/// <summary>BrowseDirection (Part 4 §7.5).</summary>
public enum BrowseDirection
{
    Forward = 0,
    Inverse = 1,
    Both = 2,
}

/// <summary>NodeClass (Part 3 §8.29), a bit mask value per class.</summary>
public enum NodeClass
{
    Unspecified = 0,
    Object = 1,
    Variable = 2,
    Method = 4,
    ObjectType = 8,
    VariableType = 16,
    ReferenceType = 32,
    DataType = 64,
    View = 128,
}

/// <summary>MonitoringMode (Part 4 §7.23).</summary>
public enum MonitoringMode
{
    Disabled = 0,
    Sampling = 1,
    Reporting = 2,
}

/// <summary>MessageSecurityMode (Part 4 §7.20).</summary>
public enum MessageSecurityMode
{
    Invalid = 0,
    None = 1,
    Sign = 2,
    SignAndEncrypt = 3,
}

/// <summary>UserTokenType (Part 4 §7.41).</summary>
public enum UserTokenType
{
    Anonymous = 0,
    UserName = 1,
    Certificate = 2,
    IssuedToken = 3,
}

/// <summary>ApplicationType (Part 4 §7.2).</summary>
public enum ApplicationType
{
    Server = 0,
    Client = 1,
    ClientAndServer = 2,
    DiscoveryServer = 3,
}

/// <summary>SecurityTokenRequestType of OpenSecureChannel (Part 4 §5.5.2.2).</summary>
public enum SecurityTokenRequestType
{
    Issue = 0,
    Renew = 1,
}

/// <summary>DataChangeTrigger of a DataChangeFilter (Part 4 §7.22.2).</summary>
public enum DataChangeTrigger
{
    Status = 0,
    StatusValue = 1,
    StatusValueTimestamp = 2,
}

/// <summary>DeadbandType of a DataChangeFilter (Part 4 §7.22.2).</summary>
public enum DeadbandType
{
    None = 0,
    Absolute = 1,
    Percent = 2,
}
