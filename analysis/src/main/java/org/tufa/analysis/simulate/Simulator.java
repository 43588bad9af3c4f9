package org.tufa.analysis.simulate;

import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.stream.IntStream;

/**
 * Runs a {@link SimulationPlan}. Units are independent (each draws from its own seeded stream), so they are
 * simulated in parallel and the result is the same whatever the thread count.
 */
public final class Simulator {
    private Simulator() {
    }

    public static SimulationResult run(SimulationPlan plan) {
        SiteConditions site = SiteConditions.generate(plan.season(), plan.seed());
        int samples = plan.season().sampleCount();
        List<Instant> timestamps = new ArrayList<>(samples);
        Instant start = plan.season().start();
        for (int s = 0; s < samples; s++) {
            timestamps.add(start.plusSeconds(900L * s));
        }
        SeededRandom noise = SeededRandom.forStream(plan.seed(), "building-noise");
        float[] oat = sampleWithNoise(site.weather().outdoorC(), site, samples, noise);
        float[] chw = sampleWithNoise(site.chilledWaterSupplyC(), site, samples, noise);
        float[] hw = sampleWithNoise(site.hotWaterSupplyC(), site, samples, noise);

        List<UnitTrace> units = IntStream.range(0, plan.units().size()).parallel().mapToObj(i -> {
            String iri = plan.units().get(i).unitIri();
            Optional<FaultEpisode> fault = plan.faults().stream().filter(f -> f.unitIri().equals(iri)).findFirst();
            return FanCoilSimulation.run(iri, UnitParameters.draw(plan.seed(), iri), site, fault, plan.seed());
        }).toList();
        if (plan.vavUnits().isEmpty()) {
            return new SimulationResult(plan, List.copyOf(timestamps), oat, chw, hw, units);
        }
        // The VAV wing draws from streams of its own (air handler, boxes), so the fan coil units above are the
        // same whether or not it is simulated.
        AirHandlerConditions ahu = AirHandlerConditions.generate(site, plan.seed());
        SeededRandom ahuNoise = SeededRandom.forStream(plan.seed(), "air-handler-noise");
        float[] sat = sampleWithNoise(ahu.supplyAirC(), site, samples, ahuNoise);
        float[] staticPa = new float[samples];
        for (int s = 0; s < samples; s++) {
            staticPa[s] = (float) (ahu.supplyStaticPa()[site.warmUpMinutes() + 15 * s] + 1.5 * ahuNoise.gaussian());
        }
        List<VavTrace> boxes = IntStream.range(0, plan.vavUnits().size()).parallel().mapToObj(i -> {
            VavSeriesTargets box = plan.vavUnits().get(i);
            Optional<FaultEpisode> fault = plan.faults().stream().filter(f -> f.unitIri().equals(box.unitIri()))
                    .findFirst();
            return VavSimulation.run(box.unitIri(), VavParameters.draw(plan.seed(), box.unitIri(), box.reheat()),
                    site, ahu, fault, plan.seed());
        }).toList();
        return new SimulationResult(plan, List.copyOf(timestamps), oat, chw, hw, units, sat, staticPa, boxes);
    }

    private static float[] sampleWithNoise(double[] perMinute, SiteConditions site, int samples,
            SeededRandom noise) {
        float[] out = new float[samples];
        for (int s = 0; s < samples; s++) {
            out[s] = (float) (perMinute[site.warmUpMinutes() + 15 * s] + FanCoilSimulation.NOISE_K * noise.gaussian());
        }
        return out;
    }
}
