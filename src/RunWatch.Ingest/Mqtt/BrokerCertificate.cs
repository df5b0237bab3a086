using System.Net.Security;
using System.Security.Cryptography.X509Certificates;

namespace RunWatch.Ingest.Mqtt;

/// <summary>Validation of a broker's TLS certificate against a site CA (a PEM file), shared by the daemon and <c>runwatch replay</c>.</summary>
public static class BrokerCertificate
{
    /// <summary>Accepts the broker's certificate when the system trusts it, or when it chains to <paramref name="ca"/> and its name matched.</summary>
    public static bool ChainsToCa(X509Certificate? certificate, SslPolicyErrors errors, X509Certificate2 ca)
    {
        ArgumentNullException.ThrowIfNull(ca);
        if (errors == SslPolicyErrors.None)
        {
            return true;
        }
        if (certificate is null || (errors & ~SslPolicyErrors.RemoteCertificateChainErrors) != 0)
        {
            return false;
        }
        using var chain = new X509Chain();
        chain.ChainPolicy.TrustMode = X509ChainTrustMode.CustomRootTrust;
        chain.ChainPolicy.CustomTrustStore.Add(ca);
        chain.ChainPolicy.RevocationMode = X509RevocationMode.NoCheck;
        using var leaf = X509CertificateLoader.LoadCertificate(certificate.GetRawCertData());
        return chain.Build(leaf);
    }
}
