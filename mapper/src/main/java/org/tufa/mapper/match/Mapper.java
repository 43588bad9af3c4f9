package org.tufa.mapper.match;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.SortedSet;
import java.util.TreeMap;
import java.util.TreeSet;
import java.util.function.Function;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.tufa.mapper.points.ExportUnits;
import org.tufa.mapper.points.PointList;
import org.tufa.mapper.points.PointRecord;
import org.tufa.mapper.rules.ClassRef;
import org.tufa.mapper.rules.Dictionary;
import org.tufa.mapper.rules.Expectation;
import org.tufa.mapper.rules.Rule;
import org.tufa.mapper.rules.RuleSet;
import org.tufa.vocabulary.BrickVocabulary;
import org.tufa.vocabulary.TagClassResolver;

/**
 * Applies a rule set to points.
 *
 * <p>Order: rules are tried in file order and the first that matches takes the point ("first match wins"). A
 * rule with {@code compete GROUP} asks for a check instead: when it wins, every other rule of the same group is
 * tried too, and if one also matches with a different class or equipment the point is a {@link Status#CONFLICT}.
 *
 * <p>Speed: a rule whose name pattern starts with '^' and literal text is only tried on names with that prefix
 * (looked up in a hash map per distinct prefix length), so 200 rules cost a few map look-ups per point, not 200
 * regex runs. Matchers are reused within one {@link #map} call. Immutable; {@link #map} may run on many threads.
 */
public final class Mapper {

    private final RuleSet rules;
    private final BrickVocabulary vocabulary;
    private final TagClassResolver pointResolver;
    private final Map<String, int[]> byPrefix;
    private final int[] prefixLengths;
    private final int[] unprefixed;
    /** Part qualifiers per (part class, when tags): a pure function, memoised. */
    private final java.util.concurrent.ConcurrentHashMap<String, Set<String>> qualifierCache =
            new java.util.concurrent.ConcurrentHashMap<>();

    private Mapper(RuleSet rules, BrickVocabulary vocabulary, TagClassResolver pointResolver) {
        this.rules = rules;
        this.vocabulary = vocabulary;
        this.pointResolver = pointResolver;
        Map<String, List<Integer>> prefixes = new HashMap<>();
        List<Integer> none = new ArrayList<>();
        TreeSet<Integer> lengths = new TreeSet<>();
        for (Rule r : rules.rules()) {
            if (r.literalPrefix().isPresent()) {
                prefixes.computeIfAbsent(r.literalPrefix().get(), k -> new ArrayList<>()).add(r.index());
                lengths.add(r.literalPrefix().get().length());
            } else {
                none.add(r.index());
            }
        }
        Map<String, int[]> idx = new HashMap<>();
        prefixes.forEach((k, v) -> idx.put(k, v.stream().mapToInt(Integer::intValue).toArray()));
        this.byPrefix = idx;
        this.prefixLengths = lengths.stream().mapToInt(Integer::intValue).toArray();
        this.unprefixed = none.stream().mapToInt(Integer::intValue).toArray();
    }

    /** Prepares a mapper (pre-filter index, class resolver) for a rule set. */
    public static Mapper fit(RuleSet rules, BrickVocabulary vocabulary) {
        return new Mapper(rules, vocabulary, TagClassResolver.fit(vocabulary, "Point"));
    }

    /** The same with a point-class resolver already fitted to {@code vocabulary} (shared across many rule sets). */
    public static Mapper fit(RuleSet rules, BrickVocabulary vocabulary, TagClassResolver pointResolver) {
        return new Mapper(rules, vocabulary, pointResolver);
    }

    /** Maps every row of a point list and checks the rule file's expectations. */
    public MappingResult map(PointList list) {
        return map(list.points());
    }

    /** Maps rows (one result per row, in order) and checks the rule file's expectations. */
    public MappingResult map(List<PointRecord> points) {
        Context ctx = new Context();
        List<Outcome> outcomes = new ArrayList<>(points.size());
        Map<String, List<Long>> linesByName = new HashMap<>();
        for (PointRecord p : points) {
            outcomes.add(classify(p, ctx));
            if (!p.name().isEmpty()) {
                linesByName.computeIfAbsent(identity(p), k -> new ArrayList<>(1)).add(p.line());
            }
        }
        List<String> warnings = new ArrayList<>(rules.warnings());
        Map<String, Integer> seen = new HashMap<>();
        TreeMap<String, String> unitWarnings = new TreeMap<>();
        List<PointMapping> out = new ArrayList<>(points.size());
        int duplicateNames = 0;
        for (int i = 0; i < points.size(); i++) {
            PointRecord p = points.get(i);
            Outcome o = outcomes.get(i);
            int occurrence = p.name().isEmpty() ? 1 : seen.merge(identity(p), 1, Integer::sum);
            List<Long> lines = p.name().isEmpty() ? List.of() : linesByName.get(identity(p));
            Status status = o.status();
            String reason = o.reason();
            if (lines.size() > 1) {
                List<Long> others = new ArrayList<>(lines);
                others.remove(p.line());
                reason = "name also on line " + join(others) + " (" + o.status().label()
                        + (o.reason().isEmpty() ? "" : ": " + o.reason()) + ")";
                status = Status.DUPLICATE;
                if (occurrence == 1) {
                    duplicateNames++;
                }
            }
            if (o.unknownUnits() != null) {
                unitWarnings.putIfAbsent(o.unknownUnits(), "line " + p.line());
            }
            out.add(new PointMapping(p, status, reason, o.assignment(), occurrence, o.status()));
        }
        long roleless = out.stream().filter(m -> m.assignment().isPresent() && m.assignment().get().score() < 1
                && m.assignment().get().tags().stream().noneMatch(RuleSet.ROLE_TAGS::contains)).count();
        if (roleless > 0 && rules.defaultRole().isEmpty()) {
            warnings.add(roleless + " tag-matched point(s) got no role (Sensor, Setpoint, Command, ...) from their name "
                    + "or object type, so sensor and setpoint classes compete; an export without object types wants "
                    + "'default-role Sensor' (or type-tags lines)");
        }
        if (duplicateNames > 0) {
            warnings.add(duplicateNames + " point name(s) occur on more than one row (same device); every row is kept "
                    + "(status 'duplicate' in the report)");
        }
        unitWarnings.forEach((u, where) -> warnings.add("units '" + u + "' (first at " + where
                + ") not recognised; no brick:hasUnit written for them"));
        return new MappingResult(rules, out, checkExpectations(ctx), warnings);
    }

    /** A point's identity: its name, within its device when the export names one. */
    static String identity(PointRecord p) {
        return p.device().isEmpty() ? p.name() : p.device() + "\u0000" + p.name();
    }

    /** Maps one point alone (no duplicate check). */
    public PointMapping classify(PointRecord point) {
        Outcome o = classify(point, new Context());
        return new PointMapping(point, o.status(), o.reason(), o.assignment(), 1);
    }

    private List<ExpectationResult> checkExpectations(Context ctx) {
        List<ExpectationResult> out = new ArrayList<>();
        for (Expectation e : rules.expectations()) {
            Outcome o = classify(e.sample(), ctx);
            String actual = describe(o);
            boolean ok = o.status() == Status.MAPPED && o.assignment().isPresent();
            if (ok) {
                Assignment a = o.assignment().get();
                ok = vocabulary.sameClass(a.className(), e.expectedClass())
                        && e.expectedEquipment().map(x -> x.equals(a.equipmentId())).orElse(true)
                        && e.expectedPart().map(x -> x.equals(a.partId())).orElse(true);
            }
            out.add(new ExpectationResult(e, ok, actual));
        }
        return out;
    }

    private static String describe(Outcome o) {
        if (o.assignment().isEmpty()) {
            return o.status().label() + (o.reason().isEmpty() ? "" : " (" + o.reason() + ")");
        }
        Assignment a = o.assignment().get();
        return o.status().label() + " " + a.className()
                + a.equipment().map(e -> " on " + e.id()).orElse("")
                + a.part().map(p -> " part " + p.localId()).orElse("") + " by " + a.ruleLabel();
    }

    /** Per-call mutable state: one reusable Matcher per rule pattern. */
    private final class Context {
        final Matcher[][] matchers = new Matcher[rules.rules().size()][];
        final Matcher[] skips = new Matcher[rules.skips().size()];
        int[] candidates = new int[16];

        Matcher matcher(int rule, int k, Pattern p, String text) {
            Matcher[] row = matchers[rule];
            if (row == null) {
                row = new Matcher[rules.rules().get(rule).matches().size()];
                matchers[rule] = row;
            }
            Matcher m = row[k];
            if (m == null) {
                m = p.matcher(text);
                row[k] = m;
                return m;
            }
            return m.reset(text);
        }

        Matcher skip(int k, String text) {
            Matcher m = skips[k];
            if (m == null) {
                m = rules.skips().get(k).pattern().matcher(text);
                skips[k] = m;
                return m;
            }
            return m.reset(text);
        }
    }

    private record Outcome(Status status, String reason, Optional<Assignment> assignment, String unknownUnits) {
        static Outcome of(Status s, String reason) {
            return new Outcome(s, reason, Optional.empty(), null);
        }
    }

    private Outcome classify(PointRecord p, Context ctx) {
        if (p.name().isEmpty()) {
            return Outcome.of(Status.REJECTED, "empty point name; fill in the name column or delete the row");
        }
        for (int k = 0; k < rules.skips().size(); k++) {
            if (ctx.skip(k, p.name()).find()) {
                RuleSet.Skip skip = rules.skips().get(k);
                return Outcome.of(Status.SKIPPED, "skip " + skip.label() + ": " + skip.reason());
            }
        }
        int n = candidates(p.name(), ctx);
        for (int c = 0; c < n; c++) {
            Rule r = rules.rules().get(ctx.candidates[c]);
            Map<String, String> groups = match(r, p, ctx);
            if (groups == null) {
                continue;
            }
            Outcome win = evaluate(r, p, groups);
            if (r.compete().isPresent() && win.assignment().isPresent() && win.status() != Status.UNCLASSIFIED) {
                for (Rule other : rules.rules()) {
                    if (other == r || !other.compete().equals(r.compete())) {
                        continue;
                    }
                    Map<String, String> g2 = match(other, p, ctx);
                    if (g2 == null) {
                        continue;
                    }
                    Outcome o2 = evaluate(other, p, g2);
                    if (o2.assignment().isEmpty() || o2.status() == Status.UNCLASSIFIED) {
                        continue;
                    }
                    Assignment a = win.assignment().get();
                    Assignment b = o2.assignment().get();
                    if (!vocabulary.sameClass(a.className(), b.className())
                            || !a.equipmentId().equals(b.equipmentId())) {
                        return new Outcome(Status.CONFLICT, "competing rules (group " + r.compete().get() + ") "
                                + r.label() + " says " + summary(a) + ", " + other.label() + " says " + summary(b),
                                win.assignment(), null);
                    }
                }
            }
            return win;
        }
        return Outcome.of(Status.UNMAPPED, "no rule matches");
    }

    private static String summary(Assignment a) {
        return a.className() + a.equipment().map(e -> " on " + e.id()).orElse("");
    }

    /** Rule indices worth trying for this name, in file order; returns how many were written to ctx.candidates. */
    private int candidates(String name, Context ctx) {
        int n = 0;
        int[] buf = ctx.candidates;
        for (int len : prefixLengths) {
            if (len > name.length()) {
                break;
            }
            int[] hit = byPrefix.get(name.substring(0, len));
            if (hit != null) {
                for (int h : hit) {
                    if (n == buf.length) {
                        buf = Arrays.copyOf(buf, n * 2);
                    }
                    buf[n++] = h;
                }
            }
        }
        for (int u : unprefixed) {
            if (n == buf.length) {
                buf = Arrays.copyOf(buf, n * 2);
            }
            buf[n++] = u;
        }
        Arrays.sort(buf, 0, n);
        ctx.candidates = buf;
        return n;
    }

    private static String field(PointRecord p, Rule.Field f) {
        return switch (f) {
            case NAME -> p.name();
            case DESCRIPTION -> p.description();
            case UNITS -> p.units();
            case DEVICE -> p.device();
        };
    }

    /** Named-group values when the rule matches the point (every match line holds), else null. */
    private Map<String, String> match(Rule r, PointRecord p, Context ctx) {
        if (!r.types().isEmpty() && !r.types().contains(p.objectType())) {
            return null;
        }
        List<Rule.FieldMatch> ms = r.matches();
        Matcher[] found = null;
        for (int k = 0; k < ms.size(); k++) {
            Rule.FieldMatch fm = ms.get(k);
            Matcher m = ctx.matcher(r.index(), k, fm.pattern(), field(p, fm.field()));
            boolean hit = m.find();
            if (hit == fm.negated()) {
                return null;
            }
            if (!fm.groups().isEmpty()) {
                if (found == null) {
                    found = new Matcher[ms.size()];
                }
                found[k] = m;
            }
        }
        Map<String, String> groups = new HashMap<>();
        if (found != null) {
            for (int k = 0; k < ms.size(); k++) {
                if (found[k] == null) {
                    continue;
                }
                for (String g : ms.get(k).groups()) {
                    String v = found[k].group(g);
                    if (v != null) {
                        groups.putIfAbsent(g, v);
                    }
                }
            }
        }
        return groups;
    }

    private Outcome unclassified(Rule r, String why, Optional<Assignment.Equipment> equipment, SortedSet<String> tags,
            List<String> unknown) {
        String tokens = unknown.isEmpty() ? "" : "; tokens not in the dictionary: " + String.join(" ", unknown);
        if (equipment.isEmpty()) {
            return Outcome.of(Status.UNCLASSIFIED, "rule " + r.label() + " matched but " + why + tokens);
        }
        Assignment a = new Assignment(r.label(), r.id(), "Point", 0, tags, equipment, Optional.empty(), List.of(),
                List.of(), List.of(), Optional.empty(), Optional.empty(), unknown, Optional.empty(), 0);
        return new Outcome(Status.UNCLASSIFIED, "rule " + r.label() + " matched but " + why + tokens,
                Optional.of(a), null);
    }

    private Outcome evaluate(Rule r, PointRecord p, Map<String, String> groups) {
        Function<String, String> values = slot -> {
            String v = groups.get(slot);
            if (v != null) {
                return v;
            }
            return switch (slot) {
                case "name" -> p.name();
                case "description" -> p.description();
                case "units" -> p.units();
                case "type" -> p.objectType();
                case "device" -> p.device();
                case "series" -> p.seriesId();
                default -> null;
            };
        };
        String tagText = r.tagSource().render(values);
        for (Pattern strip : r.strip()) {
            tagText = strip.matcher(tagText).replaceAll(" ");
        }
        Dictionary.Lookup lookup = r.dictionary().lookup(tagText, vocabulary);
        SortedSet<String> tags = new TreeSet<>(lookup.tags());
        tags.addAll(r.extraTags());

        Optional<Assignment.Equipment> equipment = Optional.empty();
        Optional<Assignment.Part> part = Optional.empty();
        if (r.equipment().isPresent()) {
            Rule.EquipmentSpec spec = r.equipment().get();
            String id = spec.id().render(values);
            if (id.isBlank()) {
                return Outcome.of(Status.UNCLASSIFIED, "rule " + r.label() + " matched but its equipment id '"
                        + spec.id().source() + "' came out empty");
            }
            Optional<String> eqClass = spec.className().resolve(values);
            if (eqClass.isEmpty()) {
                return Outcome.of(Status.UNCLASSIFIED, "rule " + r.label() + " matched but '"
                        + spec.className().keyText(values) + "' is not in table " + spec.className().table());
            }
            equipment = Optional.of(new Assignment.Equipment(id, eqClass.get()));
        }
        Optional<String> fixedClass = Optional.empty();
        if (r.pointClass().isPresent()) {
            ClassRef ref = r.pointClass().get();
            fixedClass = ref.resolve(values);
            if (fixedClass.isEmpty()) {
                return unclassified(r, "'" + ref.keyText(values) + "' is not in table " + ref.table(), equipment,
                        tags, lookup.unknownTokens());
            }
            tags.addAll(vocabulary.associatedTags(fixedClass.get()));
        }
        if (equipment.isPresent()) {
            Optional<Rule.PartSpec> spec = choosePart(r, tags);
            if (spec.isPresent()) {
                Optional<String> partClass = spec.get().className().resolve(values);
                if (partClass.isPresent()) {
                    String local = spec.get().id().render(values);
                    String id = equipment.get().id();
                    part = Optional.of(new Assignment.Part(id + "/" + local, local, partClass.get()));
                    if (fixedClass.isEmpty()) {
                        tags.removeAll(qualifiers(partClass.get(), spec.get().when()));
                    }
                }
            }
        }

        String className;
        double score;
        Optional<String> runnerUp = Optional.empty();
        double runnerUpScore = 0;
        Status status = Status.MAPPED;
        String classNote = "";
        if (fixedClass.isPresent()) {
            className = fixedClass.get();
            score = 1.0;
        } else {
            if (tags.isEmpty()) {
                return unclassified(r, "'" + tagText + "' gives no tags", equipment, tags, lookup.unknownTokens());
            }
            if (tags.stream().noneMatch(RuleSet.ROLE_TAGS::contains)) {
                tags.addAll(rules.typeTags().getOrDefault(p.objectType(), List.of()));
            }
            if (tags.stream().noneMatch(RuleSet.ROLE_TAGS::contains)) {
                tags.addAll(rules.defaultRole());
            }
            tags.add("Point");
            var res = pointResolver.resolve(tags);
            if (res.isEmpty() || res.get().score() < rules.minScore()) {
                return unclassified(r, "tags " + tags + (res.isEmpty() ? " fit no Brick point class"
                        : " fit no class well enough (best " + res.get().className() + String.format(
                        java.util.Locale.ROOT, " %.2f < min-score %.2f)", res.get().score(), rules.minScore())),
                        equipment, tags, lookup.unknownTokens());
            }
            if (res.get().className().equals("Point")) {
                return unclassified(r, "tags " + tags + " say only that it is a point", equipment, tags,
                        lookup.unknownTokens());
            }
            className = res.get().className();
            score = res.get().score();
            runnerUp = res.get().runnerUp();
            runnerUpScore = res.get().runnerUpScore();
            if (runnerUp.isPresent() && res.get().margin() < rules.margin()) {
                status = Status.AMBIGUOUS;
                classNote = String.format(java.util.Locale.ROOT, "%s %.2f and %s %.2f are too close to call "
                        + "(margin %.2f); tags %s", className, score, runnerUp.get(), runnerUpScore, rules.margin(),
                        tags);
            }
            if (res.get().viaDeprecated().isPresent()) {
                String dep = "tags match " + res.get().viaDeprecated().get() + ", deprecated; written as " + className;
                classNote = classNote.isEmpty() ? dep : classNote + "; " + dep;
            }
        }

        String unknownUnits = null;
        Optional<String> unit = Optional.empty();
        if (!p.units().isEmpty() && !ExportUnits.isNone(p.units())) {
            unit = ExportUnits.toQudt(p.units());
            if (unit.isEmpty()) {
                unknownUnits = p.units();
            }
        } else if (p.units().isEmpty()) {
            unit = r.unit();
            if (unit.isEmpty()) {
                SortedSet<String> all = new TreeSet<>(tags);
                all.addAll(vocabulary.associatedTags(className));
                // The rule's own unit-for lines first (a contract's convention), then the file's.
                List<Map.Entry<String, String>> defaults = new ArrayList<>(r.unitDefaults());
                defaults.addAll(rules.unitDefaults());
                for (Map.Entry<String, String> d : defaults) {
                    if (all.contains(d.getKey())) {
                        unit = Optional.of(d.getValue());
                        break;
                    }
                }
            }
        }

        List<Assignment.Link> locations = links(r.locations(), values);
        List<Assignment.Link> feeds = links(r.feeds(), values);
        List<Assignment.Link> fedBy = links(r.fedBy(), values);
        Optional<Assignment.Airflow> airflow = Optional.empty();
        String note = classNote;
        if (!lookup.unknownTokens().isEmpty()) {
            note = (note.isEmpty() ? "" : note + "; ") + "ignored tokens: " + String.join(" ", lookup.unknownTokens());
        }
        if (r.airflow().isPresent()) {
            String v = r.airflow().get().value().render(values);
            try {
                airflow = Optional.of(new Assignment.Airflow(new BigDecimal(v.trim()), r.airflow().get().unit()));
            } catch (NumberFormatException e) {
                note = (note.isEmpty() ? "" : note + "; ") + "airflow '" + v + "' is not a number, left out";
            }
        }
        if (unknownUnits != null) {
            note = (note.isEmpty() ? "" : note + "; ") + "units '" + unknownUnits + "' not recognised";
        }
        Assignment a = new Assignment(r.label(), r.id(), className, score, tags, equipment, part, locations, feeds,
                fedBy, unit, airflow, lookup.unknownTokens(), runnerUp, runnerUpScore);
        return new Outcome(status, note, Optional.of(a), unknownUnits);
    }

    /**
     * Tags that say which part a point hangs on rather than what the point is: the part class's own tags and the
     * {@code when} tags, minus Equipment and minus the tag naming the part's kind (the last word of the class
     * name: Valve for Chilled_Water_Valve, Fan for Fan). Brick has no "chilled water valve command" class; the
     * point is a Valve_Position_Command and the part carries "chilled water".
     */
    private Set<String> qualifiers(String partClass, Set<String> when) {
        return qualifierCache.computeIfAbsent(partClass + "\u0000" + String.join(" ", new TreeSet<>(when)), k -> {
            Set<String> q = new TreeSet<>(when);
            q.addAll(vocabulary.associatedTags(partClass));
            q.remove("Equipment");
            String[] words = BrickVocabulary.className(partClass).split("_");
            q.remove(words[words.length - 1]);
            return Set.copyOf(q);
        });
    }

    private Optional<Rule.PartSpec> choosePart(Rule r, Set<String> tags) {
        for (Rule.PartSpec s : r.parts()) {
            if (tags.containsAll(s.when())) {
                return Optional.of(s);
            }
        }
        for (Rule.PartSpec s : rules.parts()) {
            if (tags.containsAll(s.when())) {
                return Optional.of(s);
            }
        }
        return Optional.empty();
    }

    private static List<Assignment.Link> links(List<Rule.LinkSpec> specs, Function<String, String> values) {
        if (specs.isEmpty()) {
            return List.of();
        }
        List<Assignment.Link> out = new ArrayList<>(specs.size());
        for (Rule.LinkSpec s : specs) {
            String id = s.id().render(values);
            Optional<String> cls = s.className().resolve(values);
            if (!id.isBlank() && cls.isPresent()) {
                out.add(new Assignment.Link(cls.get(), id));
            }
        }
        return out;
    }

    private static String join(List<Long> lines) {
        StringBuilder b = new StringBuilder();
        for (Long l : lines) {
            if (b.length() > 0) {
                b.append(", ");
            }
            b.append(l);
        }
        return b.toString();
    }
}
