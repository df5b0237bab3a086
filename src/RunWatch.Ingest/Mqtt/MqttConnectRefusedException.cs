namespace RunWatch.Ingest.Mqtt;

/// <summary>The broker answered the CONNECT with a refusal (MQTTnet 5 reports it in the result instead of throwing).</summary>
public sealed class MqttConnectRefusedException : Exception
{
    /// <summary>Creates the exception.</summary>
    public MqttConnectRefusedException()
    {
    }

    /// <summary>Creates the exception with a message.</summary>
    public MqttConnectRefusedException(string message)
        : base(message)
    {
    }

    /// <summary>Creates the exception with a message and cause.</summary>
    public MqttConnectRefusedException(string message, Exception innerException)
        : base(message, innerException)
    {
    }
}
