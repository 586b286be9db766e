namespace Coupling.Figures;

/// <summary>
/// Idealised positions of the 10-20 and 10-10 electrode labels on a spherical head, seen from above: x to the right,
/// y to the front (nose), the vertex Cz at (0, 0) and the nasion, inion and preauricular level at radius 1.
/// </summary>
/// <remarks>
/// No table of measured coordinates is used: the positions are computed from the systems' definitions on a sphere
/// whose equator passes through nasion (Nz), inion (Iz) and the preauricular points. The midline Nz-Cz-Iz is cut in
/// tenths (Fpz 10 %, AFz 20 %, Fz 30 %, FCz 40 %, Cz 50 %, CPz 60 %, Pz 70 %, POz 80 %, Oz 90 %); the circumference
/// through Fpz, T7, Oz and T8 is cut in twentieths of its length (Fp1 at 10 % of the Fpz-Oz half, AF7 20 %, F7 30 %,
/// FT7 40 %, T7 50 %, TP7 60 %, P7 70 %, PO7 80 %, O1 90 %); each transverse row runs on the circle through its two
/// circumference points and its midline point, the columns 7, 5, 3, 1, z at quarter steps along it and column 9 one
/// quarter step beyond 7 (down to the preauricular level for T9). Odd numbers are on the left, even on the right.
/// Sources: Jasper HH (1958), The ten-twenty electrode system of the International Federation,
/// Electroencephalography and Clinical Neurophysiology 10:371-375; Chatrian GE, Lettich E, Nelson PL (1985), Ten
/// percent electrode system for topographic studies of spontaneous and evoked EEG activities, American Journal of EEG
/// Technology 25:83-92; the 10-10 names T7/T8/P7/P8 for the older T3/T4/T5/T6, as in Oostenveld R, Praamstra P
/// (2001), The five percent electrode system for high-resolution EEG and ERP measurements, Clinical
/// Neurophysiology 112:713-719, whose positions are computed on a sphere in the same way. The sphere is seen from
/// above in the azimuthal equidistant projection (distance from Cz proportional to the angle from the vertex).
/// Labels match without regard to case, with a leading "EEG" and a trailing reference ("-REF", "-A1", ...) ignored.
/// </remarks>
public static class StandardPositions
{
    private static readonly Dictionary<string, (double X, double Y)> Table = Build();

    /// <summary>Every label known here, upper case (old names T3-T6 included).</summary>
    public static IReadOnlyCollection<string> Labels => Table.Keys;

    /// <summary>The top-view position of <paramref name="label"/>, or false when it is not a 10-20/10-10 label.</summary>
    public static bool TryGet(string label, out double x, out double y)
    {
        ArgumentNullException.ThrowIfNull(label);
        if (Table.TryGetValue(Normalise(label), out var p)) { (x, y) = p; return true; }
        x = y = double.NaN;
        return false;
    }

    internal static string Normalise(string label)
    {
        string s = label.Trim().ToUpperInvariant();
        if (s.StartsWith("EEG", StringComparison.Ordinal) && s.Length > 3 && (s[3] is ' ' or '-' or '_' or ':'))
            s = s[4..].Trim();
        int dash = s.IndexOf('-');
        if (dash > 0) s = s[..dash];
        return s;
    }

    private static Dictionary<string, (double, double)> Build()
    {
        var table = new Dictionary<string, (double, double)>(StringComparer.Ordinal);
        void Add(string name, Vector p) => table[name] = Project(p);

        // Midline, percent of the nasion-inion arc over the vertex.
        (string Name, double Percent)[] midline =
        [
            ("NZ", 0), ("FPZ", 0.1), ("AFZ", 0.2), ("FZ", 0.3), ("FCZ", 0.4), ("CZ", 0.5),
            ("CPZ", 0.6), ("PZ", 0.7), ("POZ", 0.8), ("OZ", 0.9), ("IZ", 1.0),
        ];
        foreach (var (name, percent) in midline) Add(name, Midline(percent));

        // Circumference points without a transverse row of their own.
        Add("FP1", Circumference(18)); Add("FP2", Circumference(18).Mirror());
        Add("O1", Circumference(162)); Add("O2", Circumference(162).Mirror());

        // Transverse rows: inner name, outer name (columns 7 and 9), midline percent, circumference azimuth (degrees).
        (string Inner, string Outer, double Percent, double Azimuth, bool Nine)[] rows =
        [
            ("AF", "AF", 0.2, 36, false), ("F", "F", 0.3, 54, true), ("FC", "FT", 0.4, 72, true), ("C", "T", 0.5, 90, true),
            ("CP", "TP", 0.6, 108, true), ("P", "P", 0.7, 126, true), ("PO", "PO", 0.8, 144, true),
        ];
        foreach (var (inner, outer, percent, azimuth, nine) in rows)
        {
            var left = Circumference(azimuth);
            var arc = new Arc(left, Midline(percent), left.Mirror());
            // Column 7 at the circumference (t = 0), 5, 3, 1 at quarter steps toward the midline (t = 1), 9 a quarter beyond 7.
            (int Column, double T)[] columns = [(1, 0.75), (3, 0.5), (5, 0.25), (7, 0), (9, -0.25)];
            foreach (var (column, t) in columns)
            {
                if (column == 9 && !nine) continue;
                string prefix = column >= 7 ? outer : inner;
                var p = arc.At(t);
                Add($"{prefix}{column}", p);
                Add($"{prefix}{column + 1}", p.Mirror());
            }
        }

        // The older 10-20 names of four temporal positions.
        table["T3"] = table["T7"]; table["T4"] = table["T8"]; table["T5"] = table["P7"]; table["T6"] = table["P8"];
        return table;
    }

    /// <summary>Point at <paramref name="percent"/> of the nasion-inion arc: 0 at the nasion (front, on the equator).</summary>
    private static Vector Midline(double percent) => new(0, Math.Cos(Math.PI * percent), Math.Sin(Math.PI * percent));

    /// <summary>Point of the left half of the Fpz-T7-Oz circle (polar angle 72 degrees), <paramref name="degrees"/> from the front.</summary>
    private static Vector Circumference(double degrees)
    {
        double polar = 0.4 * Math.PI, a = degrees * Math.PI / 180;
        return new(-Math.Sin(polar) * Math.Sin(a), Math.Sin(polar) * Math.Cos(a), Math.Cos(polar));
    }

    /// <summary>Azimuthal equidistant view from above: radius = polar angle / 90 degrees.</summary>
    private static (double, double) Project(Vector p)
    {
        double h = Math.Sqrt(p.X * p.X + p.Y * p.Y);
        if (h < 1e-12) return (0, 0);
        double r = Math.Acos(Math.Clamp(p.Z, -1, 1)) / (Math.PI / 2);
        return (r * p.X / h, r * p.Y / h);
    }

    private readonly record struct Vector(double X, double Y, double Z)
    {
        public Vector Mirror() => this with { X = -X };
        public static Vector operator -(Vector a, Vector b) => new(a.X - b.X, a.Y - b.Y, a.Z - b.Z);
        public static Vector operator +(Vector a, Vector b) => new(a.X + b.X, a.Y + b.Y, a.Z + b.Z);
        public static Vector operator *(double s, Vector a) => new(s * a.X, s * a.Y, s * a.Z);
        public double Dot(Vector b) => X * b.X + Y * b.Y + Z * b.Z;
        public Vector Cross(Vector b) => new(Y * b.Z - Z * b.Y, Z * b.X - X * b.Z, X * b.Y - Y * b.X);
        public double Length => Math.Sqrt(Dot(this));
    }

    /// <summary>The circle through three points of the sphere (its cut with their plane), walked from the first to the second.</summary>
    private sealed class Arc
    {
        private readonly Vector _centre, _u, _w;
        private readonly double _radius, _angle;

        public Arc(Vector from, Vector to, Vector third)
        {
            // Circumcentre of the triangle (from, to, third).
            Vector a = from - third, b = to - third, axb = a.Cross(b);
            _centre = third + (1 / (2 * axb.Dot(axb))) * (a.Dot(a) * b - b.Dot(b) * a).Cross(axb);
            Vector f = from - _centre, t = to - _centre;
            _radius = f.Length;
            _u = (1 / _radius) * f;
            Vector w = t - t.Dot(_u) * _u;
            _w = (1 / w.Length) * w;
            _angle = Math.Atan2(t.Dot(_w), t.Dot(_u));
        }

        public Vector At(double fraction) =>
            _centre + _radius * (Math.Cos(fraction * _angle) * _u + Math.Sin(fraction * _angle) * _w);
    }
}
