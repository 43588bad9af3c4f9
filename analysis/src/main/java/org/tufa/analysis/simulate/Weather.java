package org.tufa.analysis.simulate;

import java.time.Instant;
import java.time.LocalDateTime;
import java.time.ZoneOffset;

/**
 * A synthetic, seeded outdoor climate at one-minute steps for a site at Toronto's latitude and longitude: outdoor
 * dry-bulb temperature and the solar irradiance on four vertical facades.
 *
 * <p>Temperature = annual cycle + synoptic anomaly + diurnal swing. The annual cycle and diurnal range are fitted by
 * hand to the 1981-2010 Canadian Climate Normals for Toronto Pearson (daily mean -5.5 C in January, 22.3 C in July;
 * July mean daily maximum about 27.6 C and minimum about 16.5 C; Environment and Climate Change Canada, from
 * memory). The synoptic anomaly is a first-order autoregressive process with a 48 h correlation time (weather
 * systems pass every few days), standard deviation 2.8 K in summer and 4.5 K in winter (chosen; no source). The
 * diurnal swing has its minimum near sunrise (05:00 solar time) and maximum at 15:00 (common practice), and is
 * damped on cloudy days.
 *
 * <p>Solar: sun position from Cooper's declination and Spencer's equation of time; clear-sky global horizontal
 * irradiance from Haurwitz's model, GHI = 1098 cos(z) exp(-0.057 / cos(z)) W/m2 (Haurwitz, J. Meteorology 2, 1945);
 * a seeded cloudiness process scales it; the beam share falls with cloudiness; the irradiance on a vertical facade
 * is beam times cos(incidence) plus half the diffuse and half the ground-reflected (albedo 0.2) radiation, the
 * isotropic-sky model (Liu and Jordan, Solar Energy 7(2), 1963), as in Duffie and Beckman, Solar Engineering of
 * Thermal Processes, ch. 1-2.
 */
public final class Weather {
    /** Site latitude, degrees north (Toronto Pearson, from memory). */
    public static final double LATITUDE_DEG = 43.68;
    /** Site longitude, degrees east (negative = west). */
    public static final double LONGITUDE_DEG = -79.63;
    /** Facade orientations, surface azimuth from south, west positive (Duffie and Beckman's convention). */
    public static final String[] ORIENTATIONS = {"north", "east", "south", "west"};
    private static final double[] SURFACE_AZIMUTH_DEG = {180, -90, 0, 90};

    /** The series: per minute from the origin. {@code facadeIrradiance[o][m]} in W/m2 for orientation o. */
    public record Series(Instant origin, double[] outdoorC, double[] globalHorizontal, double[][] facadeIrradiance) {
    }

    private Weather() {
    }

    /** Generates {@code minutes} one-minute samples starting at {@code origin}. */
    public static Series generate(Instant origin, int minutes, long seed) {
        SeededRandom rng = SeededRandom.forStream(seed, "weather");
        int hours = minutes / 60 + 2;
        double[] synoptic = autoregressive(rng, hours, 48.0);
        double[] fastNoise = autoregressive(rng, hours, 3.0);
        double[] cloudLatent = autoregressive(rng, hours, 18.0);

        double[] outdoor = new double[minutes];
        double[] ghi = new double[minutes];
        double[][] facade = new double[SURFACE_AZIMUTH_DEG.length][minutes];
        double phi = Math.toRadians(LATITUDE_DEG);
        long originSecond = origin.getEpochSecond();
        for (int m = 0; m < minutes; m++) {
            int h = m / 60;
            double frac = (m % 60) / 60.0;
            double syn = lerp(synoptic[h], synoptic[h + 1], frac);
            double fast = lerp(fastNoise[h], fastNoise[h + 1], frac);
            double clearness = clearness(lerp(cloudLatent[h], cloudLatent[h + 1], frac));

            LocalDateTime utc = LocalDateTime.ofEpochSecond(originSecond + 60L * m, 0, ZoneOffset.UTC);
            int dayOfYear = utc.getDayOfYear();
            double utcHours = utc.getHour() + utc.getMinute() / 60.0;
            double b = Math.toRadians((dayOfYear - 1) * 360.0 / 365.0);
            // Spencer (1971) equation of time, minutes, as given by Duffie and Beckman eq. 1.5.3.
            double eotMinutes = 229.2 * (0.000075 + 0.001868 * Math.cos(b) - 0.032077 * Math.sin(b)
                    - 0.014615 * Math.cos(2 * b) - 0.04089 * Math.sin(2 * b));
            double solarHours = utcHours + LONGITUDE_DEG / 15.0 + eotMinutes / 60.0;
            solarHours = ((solarHours % 24) + 24) % 24;

            // Annual cycle: peak on day 201 (about July 20).
            double season = Math.cos(2 * Math.PI * (dayOfYear - 201) / 365.0);
            double mean = 8.4 + 13.9 * season;
            double halfRange = 4.6 + 0.9 * season;
            double synopticSigma = 3.65 - 0.85 * season;
            outdoor[m] = mean + synopticSigma * syn + 0.5 * fast
                    + halfRange * (0.55 + 0.6 * clearness) * diurnalShape(solarHours);

            double decl = declination(dayOfYear);
            double omega = Math.toRadians(15.0 * (solarHours - 12.0));
            double cosZenith = cosZenith(dayOfYear, solarHours);
            if (cosZenith <= 0.01) {
                continue; // night (and the last minutes of twilight): no irradiance
            }
            double clearSky = clearSkyGlobal(cosZenith);
            double global = clearness * clearSky;
            double beamShare = 0.85 * Math.max(0.0, (clearness - 0.3) / 0.7);
            double beamHorizontal = beamShare * global;
            double diffuse = global - beamHorizontal;
            double normalBeam = beamHorizontal / Math.max(cosZenith, 0.05);
            double sinZenith = Math.sqrt(Math.max(0.0, 1 - cosZenith * cosZenith));
            double cosAzimuth = (cosZenith * Math.sin(phi) - Math.sin(decl)) / Math.max(sinZenith * Math.cos(phi), 1e-9);
            double solarAzimuth = Math.signum(omega) * Math.acos(Math.max(-1, Math.min(1, cosAzimuth)));
            ghi[m] = global;
            for (int o = 0; o < SURFACE_AZIMUTH_DEG.length; o++) {
                // Vertical surface: cos(incidence) = sin(zenith) cos(solar azimuth - surface azimuth).
                double cosIncidence = sinZenith * Math.cos(solarAzimuth - Math.toRadians(SURFACE_AZIMUTH_DEG[o]));
                facade[o][m] = normalBeam * Math.max(0.0, cosIncidence) + 0.5 * diffuse + 0.5 * 0.2 * global;
            }
        }
        return new Series(origin, outdoor, ghi, facade);
    }

    /** Solar declination, radians, by Cooper's formula (Duffie and Beckman eq. 1.6.1a). */
    static double declination(int dayOfYear) {
        return Math.toRadians(23.45 * Math.sin(Math.toRadians(360.0 * (284 + dayOfYear) / 365.0)));
    }

    /** Cosine of the solar zenith angle at the site (Duffie and Beckman eq. 1.6.5); hour angle 15 degrees/hour. */
    static double cosZenith(int dayOfYear, double solarHours) {
        double phi = Math.toRadians(LATITUDE_DEG);
        double decl = declination(dayOfYear);
        double omega = Math.toRadians(15.0 * (solarHours - 12.0));
        return Math.cos(phi) * Math.cos(decl) * Math.cos(omega) + Math.sin(phi) * Math.sin(decl);
    }

    /** Haurwitz clear-sky global horizontal irradiance, W/m2. */
    static double clearSkyGlobal(double cosZenith) {
        return cosZenith <= 0 ? 0.0 : 1098.0 * cosZenith * Math.exp(-0.057 / cosZenith);
    }

    /** Cloudiness as a clearness factor in (0.2, 1): the share of clear-sky irradiance that reaches the ground. */
    private static double clearness(double latent) {
        return 0.2 + 0.8 / (1.0 + Math.exp(-(1.6 * latent + 1.0)));
    }

    /** -1 at 05:00 solar time, +1 at 15:00, half-cosine rise and fall. */
    static double diurnalShape(double solarHours) {
        if (solarHours >= 5 && solarHours < 15) {
            return -Math.cos(Math.PI * (solarHours - 5) / 10.0);
        }
        double since = ((solarHours - 15) % 24 + 24) % 24;
        return Math.cos(Math.PI * since / 14.0);
    }

    /** Unit-variance first-order autoregressive series at hourly steps with the given correlation time (hours). */
    static double[] autoregressive(SeededRandom rng, int n, double correlationHours) {
        double a = Math.exp(-1.0 / correlationHours);
        double b = Math.sqrt(1 - a * a);
        double[] x = new double[n];
        x[0] = rng.gaussian();
        for (int i = 1; i < n; i++) {
            x[i] = a * x[i - 1] + b * rng.gaussian();
        }
        return x;
    }

    private static double lerp(double a, double b, double f) {
        return a + (b - a) * f;
    }
}
