package org.tufa.analysis.coverage;

import com.google.gson.GsonBuilder;
import com.google.gson.JsonArray;
import com.google.gson.JsonElement;
import com.google.gson.JsonNull;
import com.google.gson.JsonObject;
import com.google.gson.JsonPrimitive;
import java.io.IOException;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;

/** Writes {@code coverage.csv} and {@code coverage.json}: same content, JSON adds candidates and hints. */
public final class CoverageFiles {
    /** The value of a role column when several points qualified. */
    public static final String AMBIGUOUS = "ambiguous";
    public static final String CSV_FILE = "coverage.csv";
    public static final String JSON_FILE = "coverage.json";

    private CoverageFiles() {
    }

    /** Writes both files into the directory (created if needed) and returns their paths. */
    public static List<Path> write(FleetCoverage coverage, Path dir) {
        org.tufa.common.OutputFiles.ensureFolder(dir);
        Path csv = dir.resolve(CSV_FILE);
        Path json = dir.resolve(JSON_FILE);
        writeString(csv, csv(coverage));
        writeString(json, json(coverage));
        return List.of(csv, json);
    }

    /**
     * One row per unit, sorted by unit IRI: unit, label, unit_class, profile, unit_kind, one column per role of the
     * profiles used (point IRI, empty, or {@code ambiguous}; empty too for a role the unit's profile does not
     * have), analyzable, missing (the unit's unmet requirements, ';'-separated), one {@code <mode>_analyzable}
     * column per mode of the profiles used (empty when the unit's profile has no such mode), nominal_airflow_m3s.
     */
    public static String csv(FleetCoverage coverage) {
        List<String> roles = coverage.roleNames();
        List<String> modes = coverage.modeNames();
        List<String> header = new ArrayList<>(List.of("unit", "label", "unit_class", "profile", "unit_kind"));
        header.addAll(roles);
        header.add("analyzable");
        header.add("missing");
        modes.forEach(m -> header.add(m + "_analyzable"));
        header.add("nominal_airflow_m3s");
        StringWriter out = new StringWriter();
        CSVFormat format = CSVFormat.DEFAULT.builder().setRecordSeparator("\n").get();
        try (CSVPrinter printer = new CSVPrinter(out, format)) {
            printer.printRecord(header);
            for (UnitCoverage u : coverage.units()) {
                List<String> row = new ArrayList<>(List.of(u.unit(), org.tufa.common.CsvCells.neutral(u.label()), u.unitClass(), u.profileName(),
                        u.unitKind()));
                for (String role : roles) {
                    RoleMatch m = u.roles().get(role);
                    row.add(m == null ? "" : switch (m.status()) {
                        case FOUND -> m.point().orElseThrow().iri();
                        case AMBIGUOUS -> AMBIGUOUS;
                        case MISSING -> "";
                    });
                }
                row.add(Boolean.toString(u.analyzable()));
                row.add(String.join(";", u.missing()));
                for (String mode : modes) {
                    Boolean v = u.modes().get(mode);
                    row.add(v == null ? "" : v.toString());
                }
                row.add(u.nominalAirflow().map(a -> number(a.cubicMetresPerSecond())).orElse(""));
                printer.printRecord(row);
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return out.toString();
    }

    /** The same content as JSON, keys in a fixed order, plus candidates of ambiguous roles and untagged hints. */
    public static String json(FleetCoverage coverage) {
        JsonObject root = new JsonObject();
        root.add("profiles", strings(coverage.profiles().stream().map(Profile::name).toList()));
        root.addProperty("profiles_chosen_automatically", coverage.automatic());
        JsonArray classes = new JsonArray();
        coverage.unitClasses().forEach(classes::add);
        root.add("unit_classes", classes);
        JsonObject summary = new JsonObject();
        summary.addProperty("units", coverage.units().size());
        summary.addProperty("analyzable", coverage.analyzableCount());
        summary.addProperty("without_profile", coverage.unitsWithoutProfile().size());
        JsonObject byProfile = new JsonObject();
        for (Profile p : coverage.profilesUsed()) {
            JsonObject o = new JsonObject();
            o.addProperty("unit_kind", p.unitKind());
            o.addProperty("units", coverage.unitsOf(p).size());
            o.addProperty("analyzable", coverage.unitsOf(p).stream().filter(UnitCoverage::analyzable).count());
            JsonObject modes = new JsonObject();
            p.modes().forEach(m -> modes.addProperty(m.name(), coverage.modeCount(p, m.name())));
            o.add("analyzable_by_mode", modes);
            byProfile.add(p.name(), o);
        }
        summary.add("by_profile", byProfile);
        root.add("summary", summary);
        JsonObject undeclared = new JsonObject();
        coverage.undeclaredBrickClasses().forEach(undeclared::addProperty);
        root.add("undeclared_brick_classes", undeclared);
        root.addProperty("full_brick_vocabulary", coverage.fullBrick());
        JsonArray units = new JsonArray();
        for (UnitCoverage u : coverage.units()) {
            JsonObject o = new JsonObject();
            o.addProperty("unit", u.unit());
            o.addProperty("label", u.label());
            o.addProperty("unit_class", u.unitClass());
            o.add("profile", u.profile().isEmpty() ? JsonNull.INSTANCE : new JsonPrimitive(u.profileName()));
            o.addProperty("unit_kind", u.unitKind());
            o.addProperty("analyzable", u.analyzable());
            JsonObject um = new JsonObject();
            u.modes().forEach(um::addProperty);
            o.add("modes", um);
            o.add("missing", strings(u.missing()));
            o.add("ambiguous", strings(u.ambiguous()));
            JsonObject roles = new JsonObject();
            u.roles().forEach((name, m) -> roles.add(name, roleJson(m)));
            o.add("roles", roles);
            o.add("nominal_airflow", u.nominalAirflow().<JsonElement>map(a -> {
                JsonObject f = new JsonObject();
                f.addProperty("value", a.value());
                f.addProperty("unit", a.unitIri());
                f.addProperty("m3_per_s", a.cubicMetresPerSecond());
                return f;
            }).orElse(JsonNull.INSTANCE));
            o.add("problems", strings(u.problems()));
            units.add(o);
        }
        root.add("units", units);
        return new GsonBuilder().setPrettyPrinting().disableHtmlEscaping().serializeNulls().create().toJson(root) + "\n";
    }

    private static JsonObject roleJson(RoleMatch m) {
        JsonObject o = new JsonObject();
        o.addProperty("status", m.status().name().toLowerCase(Locale.ROOT));
        if (m.place() != null) {
            o.addProperty("found_on", m.place().label());
        }
        m.point().ifPresent(p -> o.add("point", pointJson(p)));
        if (m.status() == MatchStatus.AMBIGUOUS) {
            JsonArray c = new JsonArray();
            m.candidates().forEach(p -> c.add(pointJson(p)));
            o.add("candidates", c);
        }
        if (!m.untagged().isEmpty()) {
            JsonArray c = new JsonArray();
            m.untagged().forEach(p -> c.add(pointJson(p)));
            o.add("untagged_candidates", c);
        }
        return o;
    }

    private static JsonObject pointJson(PointRef p) {
        JsonObject o = new JsonObject();
        o.addProperty("iri", p.iri());
        o.add("label", nullable(p.label()));
        o.add("timeseries_id", nullable(p.timeseriesId()));
        o.add("unit", nullable(p.unitOfMeasureIri()));
        o.addProperty("class", p.brickClass());
        return o;
    }

    private static JsonElement nullable(String s) {
        return s == null ? JsonNull.INSTANCE : new JsonPrimitive(s);
    }

    private static JsonArray strings(List<String> values) {
        JsonArray a = new JsonArray();
        values.forEach(a::add);
        return a;
    }

    /** Shortest text that reads back as the same double (Java's Double.toString), without exponent for usual sizes. */
    static String number(double v) {
        return new java.math.BigDecimal(Double.toString(v)).stripTrailingZeros().toPlainString();
    }

    private static void writeString(Path file, String text) {
        org.tufa.common.OutputFiles.writeString(file, text);
    }
}
