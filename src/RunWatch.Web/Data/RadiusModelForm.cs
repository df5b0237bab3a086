namespace RunWatch.Web.Data;

/// <summary>Form of the radius model.</summary>
public enum RadiusModelForm
{
    Linear,
    PowerLaw,
}
