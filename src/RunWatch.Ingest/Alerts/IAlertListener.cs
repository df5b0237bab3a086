using RunWatch.Storage;

namespace RunWatch.Ingest.Alerts;

/// <summary>Told of every alert change (raised, acknowledged, shelved, cleared) after it is stored; for live views.</summary>
public interface IAlertListener
{
    void AlertChanged(AlertRecord alert, string change);
}
