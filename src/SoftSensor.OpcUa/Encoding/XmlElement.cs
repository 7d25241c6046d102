namespace SoftSensor.OpcUa.Encoding;

/// <summary>An XmlElement value (Part 6 §5.2.2.8), kept as its UTF-8 text; the client never parses it.</summary>
public readonly record struct XmlElement(string? Xml);
