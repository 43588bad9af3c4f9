package org.tufa.mapper.learn;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.SortedSet;
import java.util.TreeMap;
import java.util.TreeSet;
import java.util.regex.Pattern;
import org.tufa.mapper.match.Mapper;
import org.tufa.mapper.match.MappingResult;
import org.tufa.mapper.match.PointMapping;
import org.tufa.mapper.match.Status;
import org.tufa.mapper.points.PointRecord;
import org.tufa.mapper.rules.Rule;
import org.tufa.mapper.rules.RuleFileParser;
import org.tufa.mapper.rules.RuleSet;
import org.tufa.vocabulary.BrickVocabulary;
import org.tufa.vocabulary.TagClassResolver;

/**
 * Proposes rule-file lines that make the rules reproduce labelled examples (point name -> class, equipment).
 *
 * <p>Two steps, each checked by mapping the examples again:
 * <ol>
 *   <li><b>Rules for examples no rule takes.</b> Per example, the equipment id and the name are aligned on their
 *   longest common run of letters and digits that holds a digit (the unit's number: "R800A" in
 *   {@code temp_sensor_hvac_zone_R800A} and {@code vav_R800A}). Examples whose equipment ids have the same shape
 *   around that run ({@code vav_{id}}), the same equipment class and the same word just before the run (the
 *   context, "zone_") form one rule: the context is literal, the run a group {@code id}, and the class is read
 *   from the tags of the whole name (step 2 then teaches the dictionary which of its words mean nothing).</li>
 *   <li><b>Dictionary lines.</b> For every token of the examples a rule gets wrong, the tags all examples holding
 *   that token agree on (the intersection of their classes' Brick tags) are proposed as its meaning in that rule
 *   ({@code abbr TOKEN = Tags}, or {@code = -} when they agree on none), when that differs from what the
 *   dictionary says now. Candidates are tried most-supported first, in two passes; one is kept only when it
 *   makes more examples come out right or, as many being right, brings their tags nearer their classes' tags
 *   (summed Jaccard index).</li>
 * </ol>
 * The alignment-and-generalise idea follows the published approach of learning parsing rules from a few labelled
 * examples (Bhattacharya, Ploennigs and Culler, BuildSys 2015); the token-intersection and keep-only-if-better
 * steps are our own. Pure: no I/O, deterministic (candidates in a fixed order).
 */
public final class ExampleLearner {

    /** Proposed lines, and how many examples the rules reproduce before and after them. */
    public record Learned(List<String> newRules, Map<String, List<String>> ruleLines, int examples, int before,
            int after, List<String> stillWrong) {
    }

    private static final int MAX_CANDIDATES = 60;

    private final Path file;
    private final BrickVocabulary vocabulary;
    private final List<Example> examples;
    private final TagClassResolver resolver;

    private ExampleLearner(Path file, BrickVocabulary vocabulary, List<Example> examples) {
        this.file = file;
        this.vocabulary = vocabulary;
        this.examples = examples;
        this.resolver = TagClassResolver.fit(vocabulary, "Point");
    }

    /** Learns from examples against a rule file's text. */
    public static Learned fit(Path file, String ruleText, BrickVocabulary vocabulary, List<Example> examples) {
        return new ExampleLearner(file, vocabulary, examples).run(ruleText);
    }

    private Learned run(String ruleText) {
        List<String> lines = new ArrayList<>(List.of(ruleText.split("\r?\n|\r", -1)));
        int before = reproduced(map(lines));

        // 1. rules for examples no rule takes
        MappingResult first = map(lines);
        List<Example> untaken = new ArrayList<>();
        for (int i = 0; i < examples.size(); i++) {
            if (first.mappings().get(i).outcome() == Status.UNMAPPED) {
                untaken.add(examples.get(i));
            }
        }
        List<String> newRules = synthesiseRules(untaken);
        if (!newRules.isEmpty()) {
            List<String> trial = new ArrayList<>(lines);
            trial.add("");
            trial.addAll(newRules);
            if (reproducedOrTaken(map(trial)) > reproducedOrTaken(first)) {
                lines = trial;
            } else {
                newRules = List.of();
            }
        }

        // 2. dictionary lines, per rule, kept only when they help
        Map<String, List<String>> added = new LinkedHashMap<>();
        long best = objective(map(lines));
        List<Candidate> candidates = candidates(lines);
        List<Candidate> kept = new ArrayList<>();
        // two passes: a line may help only once another has cleared a token out of the way
        for (int pass = 0; pass < 2; pass++) {
            for (Candidate c : candidates) {
                if (kept.contains(c)) {
                    continue;
                }
                List<String> trial = insert(lines, c.ruleId(), c.line());
                if (trial == null) {
                    continue;
                }
                long score = objective(map(trial));
                if (score > best) {
                    best = score;
                    lines = trial;
                    kept.add(c);
                    added.computeIfAbsent(c.ruleId(), k -> new ArrayList<>()).add(c.line());
                }
            }
        }
        MappingResult last = map(lines);
        List<String> wrong = new ArrayList<>();
        for (int i = 0; i < examples.size(); i++) {
            if (!right(examples.get(i), last.mappings().get(i))) {
                PointMapping m = last.mappings().get(i);
                wrong.add(examples.get(i).point().name() + " (" + examples.get(i).className() + "): "
                        + m.outcome().label() + m.assignment().map(a -> " " + a.className()).orElse(""));
            }
        }
        return new Learned(newRules, added, examples.size(), before, reproduced(last), wrong);
    }

    private MappingResult map(List<String> lines) {
        RuleSet rs = RuleFileParser.parse(file, String.join("\n", lines), vocabulary);
        List<PointRecord> points = new ArrayList<>();
        for (Example e : examples) {
            points.add(e.point());
        }
        return Mapper.fit(rs, vocabulary, resolver).map(points);
    }

    private int reproduced(MappingResult r) {
        int n = 0;
        for (int i = 0; i < examples.size(); i++) {
            n += right(examples.get(i), r.mappings().get(i)) ? 1 : 0;
        }
        return n;
    }

    /**
     * What a candidate line must raise: examples right first, then (to break ties and let a line count that only
     * clears the way for another) the summed Jaccard index of each example's tags against its class's tags.
     */
    private long objective(MappingResult r) {
        long right = 0;
        double near = 0;
        for (int i = 0; i < examples.size(); i++) {
            PointMapping m = r.mappings().get(i);
            right += right(examples.get(i), m) ? 1 : 0;
            if (m.assignment().isPresent()) {
                SortedSet<String> want = wanted(examples.get(i).className());
                want.add("Point");
                near += TagClassResolver.jaccard(m.assignment().get().tags(), want);
            }
        }
        return right * 1_000_000L + Math.round(near * 100);
    }

    private int reproducedOrTaken(MappingResult r) {
        int n = 0;
        for (int i = 0; i < examples.size(); i++) {
            PointMapping m = r.mappings().get(i);
            n += right(examples.get(i), m) ? 2 : m.outcome() != Status.UNMAPPED ? 1 : 0;
        }
        return n;
    }

    /** Mapped, with the example's class (or an equivalent) and, when both say one, its equipment. */
    private boolean right(Example e, PointMapping m) {
        if (m.outcome() != Status.MAPPED || m.assignment().isEmpty()) {
            return false;
        }
        var a = m.assignment().get();
        boolean cls = vocabulary.sameClass(a.className(), e.className());
        boolean eq = e.equipment().isEmpty() || a.equipment().isEmpty() || a.equipmentId().equals(e.equipment());
        return cls && eq;
    }

    // ---- step 1 -------------------------------------------------------------------------------------------

    private record Aligned(Example example, String before, String key, String after, String template) {
    }

    private List<String> synthesiseRules(List<Example> untaken) {
        Map<String, List<Aligned>> groups = new TreeMap<>();
        for (Example e : untaken) {
            if (e.equipment().isEmpty() || e.equipment().chars().anyMatch(Character::isWhitespace)) {
                continue;
            }
            Optional<int[]> run = commonRun(e.point().name(), e.equipment());
            if (run.isEmpty()) {
                continue;
            }
            int[] r = run.get();
            String name = e.point().name();
            String key = name.substring(r[0], r[1]);
            String template = e.equipment().substring(0, r[2]) + "{id}" + e.equipment().substring(r[2] + key.length());
            String before = name.substring(0, r[0]);
            Aligned a = new Aligned(e, before, key, name.substring(r[1]), template);
            String cls = e.equipmentClass().isEmpty() ? "Equipment" : e.equipmentClass();
            groups.computeIfAbsent(template + "\u0000" + cls + "\u0000" + context(before), k -> new ArrayList<>())
                    .add(a);
        }
        List<String> out = new ArrayList<>();
        int n = 0;
        for (Map.Entry<String, List<Aligned>> g : groups.entrySet()) {
            List<Aligned> as = g.getValue();
            String[] k = g.getKey().split("\u0000", -1);
            String cls = k[1];
            String context = k[2];
            boolean anchored = as.stream().allMatch(a -> a.before().equals(context));
            boolean digits = as.stream().allMatch(a -> a.key().chars().allMatch(Character::isDigit));
            String keyRe = digits ? "\\d+" : "[A-Za-z0-9]+";
            String re = (anchored ? "^" : context.isEmpty() ? "(?<![A-Za-z0-9])" : "") + quote(context)
                    + "(?<id>" + keyRe + ")(?![A-Za-z0-9])";
            n++;
            out.add("rule learned-" + n + "   # from " + as.size() + " example(s), e.g. " + as.get(0).example().point()
                    .name());
            out.add("  match name " + re);
            out.add("  class tags {name}");
            out.add("  equipment " + as.get(0).template() + " " + cls);
        }
        return out;
    }

    /** The word and delimiters right before the unit's number ("Zone_Temp_" -> "Temp_", "TEMP" -> "TEMP"). */
    static String context(String before) {
        var m = Pattern.compile("[A-Za-z]*[^A-Za-z0-9]*$").matcher(before);
        return m.find() ? m.group() : "";
    }

    /** Longest common run of letters/digits holding a digit: {start in a, end in a, start in b}; else empty. */
    static Optional<int[]> commonRun(String a, String b) {
        int[] best = null;
        for (int i = 0; i < a.length(); i++) {
            for (int j = 0; j < b.length(); j++) {
                int k = 0;
                while (i + k < a.length() && j + k < b.length() && a.charAt(i + k) == b.charAt(j + k)
                        && Character.isLetterOrDigit(a.charAt(i + k))) {
                    k++;
                }
                if (k == 0) {
                    continue;
                }
                boolean digit = a.substring(i, i + k).chars().anyMatch(Character::isDigit);
                // whole runs only: the match may not continue a word on either side in the name
                boolean whole = (i == 0 || !Character.isLetterOrDigit(a.charAt(i - 1))
                        || Character.isLetter(a.charAt(i - 1)) != Character.isLetter(a.charAt(i)))
                        && (i + k == a.length() || !Character.isLetterOrDigit(a.charAt(i + k)));
                if (digit && whole && (best == null || k > best[1] - best[0])) {
                    best = new int[] {i, i + k, j};
                }
            }
        }
        return Optional.ofNullable(best);
    }





    private static String quote(String literal) {
        StringBuilder b = new StringBuilder();
        for (char c : literal.toCharArray()) {
            if ("\\.[]{}()*+?^$|".indexOf(c) >= 0) {
                b.append('\\');
            }
            b.append(c);
        }
        return b.toString();
    }

    // ---- step 2 -------------------------------------------------------------------------------------------

    private record Candidate(String ruleId, String line, int support) {
    }

    private List<Candidate> candidates(List<String> lines) {
        RuleSet rs = RuleFileParser.parse(file, String.join("\n", lines), vocabulary);
        MappingResult r = Mapper.fit(rs, vocabulary, resolver).map(examples.stream().map(Example::point).toList());
        Map<String, Rule> rules = new TreeMap<>();
        for (Rule rule : rs.rules()) {
            rules.put(rule.label(), rule);
        }
        // per rule and token: the examples holding it, and whether one of them is wrong
        Map<String, Map<String, List<Example>>> byRuleToken = new TreeMap<>();
        Map<String, Map<String, Integer>> wrongCount = new TreeMap<>();
        for (int i = 0; i < examples.size(); i++) {
            PointMapping m = r.mappings().get(i);
            if (m.assignment().isEmpty()) {
                continue;
            }
            Rule rule = rules.get(m.assignment().get().ruleLabel());
            if (rule == null) {
                continue;
            }
            Example e = examples.get(i);
            boolean ok = right(e, m);
            String text = e.point().name();
            for (Pattern p : rule.strip()) {
                text = p.matcher(text).replaceAll(" ");
            }
            SortedSet<String> seen = new TreeSet<>();
            for (String t : rule.dictionary().tokens(text, vocabulary)) {
                String k = t.toUpperCase(Locale.ROOT);
                if (k.chars().anyMatch(Character::isDigit) && !org.tufa.mapper.rules.Tokenizer
                        .mixesLettersAndDigits(k) || !seen.add(k)) {
                    continue;
                }
                byRuleToken.computeIfAbsent(rule.id(), x -> new TreeMap<>()).computeIfAbsent(k,
                        x -> new ArrayList<>()).add(e);
                if (!ok) {
                    wrongCount.computeIfAbsent(rule.id(), x -> new TreeMap<>()).merge(k, 1, Integer::sum);
                }
            }
        }
        Map<String, Rule> byId = new TreeMap<>();
        rs.rules().forEach(x -> byId.put(x.id(), x));
        List<Candidate> out = new ArrayList<>();
        for (var ruleEntry : wrongCount.entrySet()) {
            Rule rule = byId.get(ruleEntry.getKey());
            for (var tokenEntry : ruleEntry.getValue().entrySet()) {
                String token = tokenEntry.getKey();
                SortedSet<String> agreed = null;
                for (Example e : byRuleToken.get(rule.id()).get(token)) {
                    SortedSet<String> want = wanted(e.className());
                    want.removeAll(rs.defaultRole());
                    if (agreed == null) {
                        agreed = new TreeSet<>(want);
                    } else {
                        agreed.retainAll(want);
                    }
                }
                SortedSet<String> now = rule.dictionary().lookup(token, vocabulary).tags();
                if (agreed == null || agreed.equals(now) || agreed.isEmpty() && now.isEmpty()) {
                    continue;
                }
                String line = "abbr " + token + " = " + (agreed.isEmpty() ? "-" : String.join(" ", agreed));
                out.add(new Candidate(rule.id(), line, tokenEntry.getValue()));
            }
        }
        out.sort(Comparator.comparingInt(Candidate::support).reversed().thenComparing(Candidate::ruleId)
                .thenComparing(Candidate::line));
        return out.size() > MAX_CANDIDATES ? out.subList(0, MAX_CANDIDATES) : out;
    }

    /** The tags a class stands for: its own, an equivalent's, or the words of its name that are tags; no Point. */
    private SortedSet<String> wanted(String className) {
        SortedSet<String> t = new TreeSet<>(vocabulary.associatedTags(className));
        if (t.isEmpty()) {
            for (String e : vocabulary.equivalents(className)) {
                if (!vocabulary.associatedTags(e).isEmpty()) {
                    t.addAll(vocabulary.associatedTags(e));
                    break;
                }
            }
        }
        if (t.isEmpty()) {
            for (String w : className.split("_")) {
                if (vocabulary.isTag(w)) {
                    t.add(w);
                }
            }
        }
        t.remove("Point");
        return t;
    }

    /** The rule text with an indented line added right under rule {@code id}'s first line; null if not found. */
    private static List<String> insert(List<String> lines, String id, String line) {
        for (int i = 0; i < lines.size(); i++) {
            String l = lines.get(i);
            if (l.startsWith("rule ") && l.substring(5).strip().split("\\s+")[0].equals(id)
                    || id.equals("rule") && l.strip().equals("rule")) {
                List<String> out = new ArrayList<>(lines);
                out.add(i + 1, "  " + line);
                return out;
            }
        }
        return null;
    }
}
