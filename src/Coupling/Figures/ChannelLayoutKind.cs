namespace Coupling.Figures;

/// <summary>How a network figure placed its channels (<see cref="ChannelLayout"/>).</summary>
internal enum ChannelLayoutKind
{
    /// <summary>At the positions of the input.</summary>
    Electrodes,

    /// <summary>At 10-20/10-10 positions on a head seen from above.</summary>
    Head,

    /// <summary>On an even grid in channel order.</summary>
    Even,
}
