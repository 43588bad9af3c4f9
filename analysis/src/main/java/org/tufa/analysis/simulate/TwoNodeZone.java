package org.tufa.analysis.simulate;

/**
 * The zone model both simulated kinds of unit share: two lumped capacitances (zone air with furnishings; building
 * mass), stepped by explicit Euler. The air node exchanges heat with outdoors through the envelope conductance,
 * with the mass node and with the unit's supply air; internal gains go half to the air, half to the mass, solar
 * gains 40 % to the air and 60 % to the mass (the usual resistance-capacitance zone model; ISO 13790's simple
 * hourly method uses the same structure). One instance per simulated zone, never shared between threads.
 */
final class TwoNodeZone {
    private double air;
    private double mass;

    TwoNodeZone(double startC) {
        this.air = startC;
        this.mass = startC;
    }

    /** The zone air temperature, C. */
    double air() {
        return air;
    }

    /**
     * Advances the zone by {@code dt} seconds.
     *
     * @param envelopeUa conductance to outdoors, W/K
     * @param massConductance air-to-mass conductance, W/K
     * @param airCapacitance zone air and furnishings, J/K
     * @param massCapacitance building mass, J/K
     * @param outdoorC outdoor air temperature
     * @param supplyW heat the unit's supply air brings to the zone air, W (negative when cooling)
     * @param internalW internal gains, W
     * @param solarW solar gains, W
     */
    void step(double dt, double envelopeUa, double massConductance, double airCapacitance, double massCapacitance,
            double outdoorC, double supplyW, double internalW, double solarW) {
        double toMassW = massConductance * (air - mass);
        double airNet = envelopeUa * (outdoorC - air) - toMassW + supplyW + 0.5 * internalW + 0.4 * solarW;
        double massNet = toMassW + 0.5 * internalW + 0.6 * solarW;
        air += dt * airNet / airCapacitance;
        mass += dt * massNet / massCapacitance;
    }

    /**
     * Internal gains, W: in occupied hours the peak times the day's occupancy profile and the day's factor, else
     * 15 % of the peak (lights left on, equipment on standby; chosen, no source).
     */
    static double internalGainsW(boolean occupied, double peakW, int minuteOfDay, int startMinute, int endMinute,
            double dayFactor) {
        return occupied ? peakW * FanCoilSimulation.occupiedProfile(minuteOfDay, startMinute, endMinute) * dayFactor
                : 0.15 * peakW;
    }
}
