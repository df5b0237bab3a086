namespace RunWatch.Core.Excursions;

/// <summary>The ISA-18.2 state of one alarm plus its raw condition (tracked even while shelved).</summary>
internal struct AlarmSlot
{
    public AlarmState State;
    public bool Condition;
    public double ShelvedUntilS;
}
