namespace WindingNotes.Report;

/// <summary>The note every report ends with.</summary>
public static class Cautions
{
    public const string Judgement =
        "These results support engineering judgement; they do not replace it. Local electrical codes and licensed practice govern the design, installation and protection of any connection.";
}
