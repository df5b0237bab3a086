using System.Net.Security;
using System.Security.Cryptography.X509Certificates;
using MQTTnet;
using MQTTnet.Formatter;
using MQTTnet.Protocol;
using RunWatch.Ingest.Configuration;

namespace RunWatch.Ingest.Mqtt;

/// <summary>Builds MQTTnet client options from <see cref="BrokerOptions"/>: persistent session, last will, TLS.</summary>
internal static class MqttClientOptionsFactory
{
    public static string StatusTopic(IngestOptions ingest, BrokerOptions broker) => ingest.TopicRoot + "/daemon/" + broker.InstanceName + "/status";

    public static MqttClientOptions Build(BrokerOptions broker, IngestOptions ingest)
    {
        var builder = new MqttClientOptionsBuilder()
            .WithTcpServer(broker.Host, broker.Port)
            .WithClientId(broker.ClientId)
            .WithProtocolVersion(broker.ProtocolVersion == "V311" ? MqttProtocolVersion.V311 : MqttProtocolVersion.V500)
            .WithKeepAlivePeriod(broker.KeepAlive)
            .WithTimeout(broker.ConnectTimeout)
            // A persistent session: without a non-zero expiry MQTT 5 discards the session at disconnect (MQTTnet#1827).
            .WithCleanStart(false)
            .WithCleanSession(false)
            .WithSessionExpiryInterval((uint)Math.Min(uint.MaxValue, broker.SessionExpiry.TotalSeconds))
            .WithReceiveMaximum((ushort)broker.ReceiveMaximum)
            .WithMaximumPacketSize((uint)broker.MaximumPacketBytes)
            .WithWillTopic(StatusTopic(ingest, broker))
            .WithWillPayload("offline"u8.ToArray())
            .WithWillRetain(true)
            .WithWillQualityOfServiceLevel(MqttQualityOfServiceLevel.AtLeastOnce);
        string? password = broker.PasswordFile is { Length: > 0 } file ? File.ReadAllText(file).TrimEnd('\r', '\n') : broker.Password;
        if (!string.IsNullOrEmpty(broker.Username))
        {
            builder.WithCredentials(broker.Username, password);
        }
        if (broker.UseTls)
        {
            var ca = broker.CaFile is { Length: > 0 } caFile ? X509CertificateLoader.LoadCertificateFromFile(caFile) : null;
            var clientCertificates = new List<X509Certificate2>();
            if (broker.ClientCertificateFile is { Length: > 0 } certFile)
            {
                using var pem = broker.ClientKeyFile is { Length: > 0 } keyFile
                    ? X509Certificate2.CreateFromPemFile(certFile, keyFile)
                    : X509Certificate2.CreateFromPemFile(certFile);
                // SslStream on Linux needs the key in a PKCS#12-backed certificate, not an ephemeral PEM one.
                clientCertificates.Add(X509CertificateLoader.LoadPkcs12(pem.Export(X509ContentType.Pkcs12), null));
            }
            builder.WithTlsOptions(tls =>
            {
                tls.UseTls(true);
                tls.WithTargetHost(broker.Host);
                if (clientCertificates.Count > 0)
                {
                    tls.WithClientCertificates(clientCertificates);
                }
                if (ca is not null)
                {
                    tls.WithCertificateValidationHandler(args => ValidateAgainstCa(args.Certificate, args.SslPolicyErrors, ca));
                }
            });
        }
        return builder.Build();
    }

    /// <summary>Accepts the broker's certificate when it chains to the configured CA and its name matched.</summary>
    internal static bool ValidateAgainstCa(X509Certificate? certificate, SslPolicyErrors errors, X509Certificate2 ca) =>
        BrokerCertificate.ChainsToCa(certificate, errors, ca);
}
