package org.tufa.mapper.rules;

import java.io.IOException;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.ByteBuffer;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.regex.PatternSyntaxException;
import org.tufa.common.InputException;
import org.tufa.mapper.points.ExportUnits;
import org.tufa.mapper.points.ObjectTypes;
import org.tufa.mapper.points.PointRecord;
import org.tufa.vocabulary.BrickVocabulary;
import org.tufa.vocabulary.NameSuggester;

/**
 * Reads a tufa rule file (format: mapper/RULES-FORMAT.md). Every error is an {@link InputException}
 * "file:line: what is wrong; what to do"; every Brick class and tag named is checked against the vocabulary.
 */
public final class RuleFileParser {

    /** Fields a template may name besides the rule's regex groups. */
    public static final Set<String> BUILT_INS = Set.of("name", "description", "units", "type", "device", "series");

    static final List<String> TOP_KEYWORDS = List.of("building", "base-iri", "abbr", "type-tags", "default-role",
            "unit-for", "part", "min-score", "margin", "strip", "skip", "table", "expect", "rule");
    static final List<String> RULE_KEYWORDS = List.of("match", "class", "tags", "equipment", "part", "location",
            "feeds", "fed-by", "unit", "unit-for", "airflow", "compete", "abbr", "strip", "expect");

    /** Default object-type tags: a hardware input senses, an output commands (BACnet usage, see notes §7). */
    static final Map<String, List<String>> DEFAULT_TYPE_TAGS = Map.of("AI", List.of("Sensor"), "AO",
            List.of("Command"), "BI", List.of("Status"), "BO", List.of("Command"), "MSI", List.of("Status"),
            "MSO", List.of("Command"));

    private static final Pattern GROUP_NAME = Pattern.compile("\\(\\?<([a-zA-Z][a-zA-Z0-9]*)>");
    private static final Pattern TRAILING_COMMENT = Pattern.compile("\\s#");
    private static final Pattern UNIT_NAME = Pattern.compile("[A-Za-z][A-Za-z0-9_\\-]*");
    /** A table look-up in a class position: TABLE[{group}]. */
    private static final Pattern TABLE_REF = Pattern.compile("([A-Za-z][A-Za-z0-9_\\-]*)\\[(.+)\\]");

    private final Path file;
    private final String fileName;
    private final BrickVocabulary vocabulary;
    private final List<String> warnings = new ArrayList<>();
    private final List<Dictionary.Entry> abbreviations = new ArrayList<>();
    private final Map<String, List<String>> typeTags = new TreeMap<>(DEFAULT_TYPE_TAGS);
    private final List<Map.Entry<String, String>> unitDefaults = new ArrayList<>();
    private final List<Rule.PartSpec> globalParts = new ArrayList<>();
    private final List<Expectation> expectations = new ArrayList<>();
    private final List<RuleBuilder> ruleBuilders = new ArrayList<>();
    private final List<RuleSet.Skip> skips = new ArrayList<>();
    private final Map<String, Map<String, String>> tables = new TreeMap<>();
    private final Map<String, Integer> tableLines = new TreeMap<>();
    private final List<Pattern> strip = new ArrayList<>();
    private final Set<String> defaultRole = new TreeSet<>();
    private final Dictionary builtIn;
    private String building;
    private Optional<String> baseIri = Optional.empty();
    private double minScore = 0.5;
    private double margin = RuleSet.DEFAULT_MARGIN;

    private RuleFileParser(Path file, BrickVocabulary vocabulary, Dictionary builtIn) {
        this.file = file;
        this.fileName = file.getFileName() == null ? file.toString() : file.getFileName().toString();
        this.vocabulary = vocabulary;
        this.builtIn = builtIn;
    }

    /** Reads and checks a rule file. */
    public static RuleSet parse(Path file, BrickVocabulary vocabulary) {
        if (!Files.isRegularFile(file)) {
            throw InputException.in(file, "rule file not found; check the path given with --rules");
        }
        byte[] bytes;
        try {
            bytes = Files.readAllBytes(file);
        } catch (IOException e) {
            throw InputException.in(file, "rule file cannot be read (" + e.getClass().getSimpleName() + ")");
        }
        String utf16 = org.tufa.common.Printable.utf16WithoutBom(bytes, 0, bytes.length);
        if (utf16 != null || bytes.length >= 2 && ((bytes[0] & 0xff) == 0xFF && (bytes[1] & 0xff) == 0xFE
                || (bytes[0] & 0xff) == 0xFE && (bytes[1] & 0xff) == 0xFF)) {
            throw InputException.in(file, "rule file is " + (utf16 == null ? "UTF-16" : utf16) + " encoded; save it "
                    + "as UTF-8");
        }
        if (org.tufa.common.Printable.looksBinary(bytes, 0, Math.min(bytes.length, 4096))) {
            throw InputException.in(file, "is not a text file (it holds binary data); give the rule file "
                    + "(format: mapper/RULES-FORMAT.md)");
        }
        String text;
        try {
            text = StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                    .decode(ByteBuffer.wrap(bytes)).toString();
        } catch (CharacterCodingException e) {
            throw InputException.in(file, "rule file is not UTF-8; save it as UTF-8");
        }
        return parse(file, text, vocabulary);
    }

    /** Parses rule-file text ({@code file} is used in messages and labels). */
    public static RuleSet parse(Path file, String text, BrickVocabulary vocabulary) {
        return new RuleFileParser(file, vocabulary, TradeAbbreviations.dictionary(vocabulary)).run(text);
    }

    private RuleSet run(String text) {
        if (text.startsWith("\uFEFF")) {
            text = text.substring(1);
        }
        String[] lines = text.split("\r?\n|\r", -1);
        RuleBuilder current = null;
        for (int i = 0; i < lines.length; i++) {
            int ln = i + 1;
            String raw = stripTrailing(lines[i]);
            String trimmed = raw.strip();
            if (trimmed.isEmpty() || trimmed.startsWith("#")) {
                continue;
            }
            boolean indented = Character.isWhitespace(raw.charAt(0));
            int sp = indexOfWhitespace(trimmed);
            String keyword = sp < 0 ? trimmed : trimmed.substring(0, sp);
            String rest = sp < 0 ? "" : trimmed.substring(sp).strip();
            if (!keyword.equals("match") && !keyword.equals("expect")) {
                // a trailing comment: white space then '#' (match and expect lines are taken verbatim)
                Matcher c = TRAILING_COMMENT.matcher(rest);
                if (c.find()) {
                    rest = rest.substring(0, c.start()).strip();
                }
            }
            if (!indented) {
                current = null;
                if (keyword.equals("rule")) {
                    if (!rest.isEmpty() && !rest.matches("[A-Za-z0-9_.\\-]+")) {
                        throw error(ln, "rule name '" + rest + "' may hold only letters, digits, '_', '-', '.'");
                    }
                    for (RuleBuilder b : ruleBuilders) {
                        if (!rest.isEmpty() && rest.equals(b.id)) {
                            throw error(ln, "rule name '" + rest + "' is already used at line " + b.line
                                    + "; give each rule its own name");
                        }
                    }
                    current = new RuleBuilder(rest.isEmpty() ? "rule" : rest, ln, ruleBuilders.size());
                    ruleBuilders.add(current);
                } else {
                    topLevel(ln, keyword, rest);
                }
            } else if (current == null) {
                if (keyword.equals("expect")) {
                    expect(ln, rest);
                } else {
                    throw error(ln, "indented line outside a rule; rule lines follow a 'rule' line, other lines "
                            + "start at the beginning of the line");
                }
            } else {
                ruleLine(current, ln, keyword, rest);
            }
        }
        if (building == null) {
            throw InputException.in(file, "no 'building NAME' line; add one (e.g. 'building Harbourview Annex')");
        }
        Dictionary dictionary = Dictionary.of(abbreviations, builtIn);
        List<Rule> rules = new ArrayList<>();
        for (RuleBuilder b : ruleBuilders) {
            rules.add(b.build(dictionary));
        }
        return new RuleSet(file, building, baseIri, rules, dictionary, typeTags, List.copyOf(defaultRole),
                unitDefaults, globalParts, minScore, margin, skips, strip, expectations, warnings);
    }

    private void topLevel(int ln, String keyword, String rest) {
        switch (keyword) {
            case "building" -> {
                if (rest.isEmpty()) {
                    throw error(ln, "'building' needs the building's name");
                }
                if (building != null) {
                    throw error(ln, "a second 'building' line; a rule file describes one building");
                }
                building = rest;
            }
            case "base-iri" -> {
                if (!rest.matches("[A-Za-z][A-Za-z0-9+.\\-]*:[^\\s<>\"{}|\\\\^`]+")) {
                    throw error(ln, "'" + rest + "' is not an absolute IRI; write e.g. "
                            + "'base-iri https://example.org/my-building/'");
                }
                baseIri = Optional.of(rest);
            }
            case "abbr" -> abbreviations.addAll(abbreviation(ln, rest));
            case "default-role" -> {
                List<String> tags = tagList(ln, rest);
                for (String t : tags) {
                    if (!RuleSet.ROLE_TAGS.contains(t)) {
                        throw error(ln, "'default-role' takes role tags (" + String.join(", ", RuleSet.ROLE_TAGS)
                                + "), not '" + t + "'");
                    }
                }
                defaultRole.addAll(tags);
            }
            case "margin" -> {
                try {
                    margin = Double.parseDouble(rest);
                } catch (NumberFormatException e) {
                    margin = -1;
                }
                if (!(margin >= 0 && margin < 1)) {
                    throw error(ln, "'margin' needs a number in [0, 1), e.g. 'margin 0.1' (0: only ties are "
                            + "ambiguous)");
                }
            }
            case "strip" -> strip.add(regex(ln, rest));
            case "skip" -> {
                int b = rest.indexOf(" because ");
                if (b <= 0 || rest.substring(b + 9).isBlank()) {
                    throw error(ln, "'skip' needs 'REGEX because REASON', e.g. 'skip _Request$ because request "
                            + "points are not modelled'");
                }
                skips.add(new RuleSet.Skip(regex(ln, rest.substring(0, b).strip()), rest.substring(b + 9).strip(),
                        fileName + ":" + ln));
            }
            case "table" -> table(ln, rest);
            case "type-tags" -> {
                int eq = rest.indexOf('=');
                if (eq < 0) {
                    throw error(ln, "'type-tags' needs 'TYPE = Tag Tag...' (or 'TYPE = -' for none)");
                }
                String type = ObjectTypes.normalise(rest.substring(0, eq)).orElseThrow(() -> error(ln,
                        "'" + rest.substring(0, eq).strip() + "' is not a BACnet object type; use one of "
                                + ObjectTypes.KNOWN));
                typeTags.put(type, tagList(ln, rest.substring(eq + 1)));
            }
            case "unit-for" -> {
                String[] w = rest.split("\\s+");
                if (w.length != 2) {
                    throw error(ln, "'unit-for' needs 'Tag UNIT', e.g. 'unit-for Temperature DEG_F'");
                }
                unitDefaults.add(Map.entry(tag(ln, w[0]), unit(ln, w[1])));
            }
            case "part" -> {
                Rule.PartSpec p = part(ln, rest, null);
                if (p.when().isEmpty()) {
                    throw error(ln, "a part outside a rule needs 'when Tag...' (which points it applies to); "
                            + "or indent it under a rule");
                }
                if (!p.id().slots().isEmpty()) {
                    throw error(ln, "a part outside a rule takes a plain id (no {group}); indent it under a rule "
                            + "to use groups");
                }
                globalParts.add(p);
            }
            case "min-score" -> {
                try {
                    minScore = Double.parseDouble(rest);
                } catch (NumberFormatException e) {
                    minScore = -1;
                }
                if (!(minScore > 0 && minScore <= 1)) {
                    throw error(ln, "'min-score' needs a number in (0, 1], e.g. 'min-score 0.5'");
                }
            }
            case "expect" -> expect(ln, rest);
            default -> {
                if (RULE_KEYWORDS.contains(keyword)) {
                    throw error(ln, "'" + keyword + "' belongs inside a rule: indent it under a 'rule' line");
                }
                throw error(ln, "unknown keyword '" + keyword + "'" + suggest(keyword, TOP_KEYWORDS)
                        + "; lines start with one of " + String.join(", ", TOP_KEYWORDS));
            }
        }
    }

    private void ruleLine(RuleBuilder r, int ln, String keyword, String rest) {
        switch (keyword) {
            case "match" -> {
                int sp = indexOfWhitespace(rest);
                String what = sp < 0 ? rest : rest.substring(0, sp);
                String arg = sp < 0 ? "" : rest.substring(sp).strip();
                boolean negated = what.equals("not");
                if (negated) {
                    int sp2 = indexOfWhitespace(arg);
                    what = sp2 < 0 ? arg : arg.substring(0, sp2);
                    arg = sp2 < 0 ? "" : arg.substring(sp2).strip();
                }
                if (arg.isEmpty()) {
                    throw error(ln, "'match " + (negated ? "not " : "") + what + "' needs a value");
                }
                switch (what) {
                    case "name", "description", "units", "device" -> {
                        Pattern pattern = regex(ln, arg);
                        Rule.Field field = Rule.Field.valueOf(what.toUpperCase(Locale.ROOT));
                        r.matches.add(new Rule.FieldMatch(field, pattern, negated,
                                negated ? List.of() : List.copyOf(groupNames(pattern))));
                    }
                    case "type" -> {
                        if (negated) {
                            throw error(ln, "'match not type' is not supported; list the types the rule takes");
                        }
                        for (String t : arg.split("[\\s,]+")) {
                            r.types.add(ObjectTypes.normalise(t).orElseThrow(() -> error(ln, "'" + t
                                    + "' is not a BACnet object type; use one of " + ObjectTypes.KNOWN)));
                        }
                    }
                    default -> throw error(ln, "'match " + what + "': match what? write 'match name REGEX', "
                            + "'match description REGEX', 'match units REGEX', 'match device REGEX', "
                            + "'match type AI AV ...', or 'match not name REGEX' to exclude");
                }
            }
            case "class" -> {
                if (r.classLine > 0) {
                    throw error(ln, "a second 'class' line in rule '" + r.id + "' (first at line " + r.classLine + ")");
                }
                r.classLine = ln;
                if (rest.equals("tags") || rest.startsWith("tags ")) {
                    String src = rest.substring(4).strip();
                    r.tagSource = template(ln, src.isEmpty() ? "{name}" : src);
                    r.templates.add(Map.entry(r.tagSource, ln));
                } else if (rest.isEmpty() || rest.contains(" ")) {
                    throw error(ln, "'class' needs one Brick class name, 'TABLE[{group}]', or 'tags {group}' to "
                            + "resolve it from tags");
                } else {
                    r.pointClass = Optional.of(classRef(ln, rest, r));
                }
            }
            case "tags" -> r.extraTags.addAll(tagList(ln, rest));
            case "equipment" -> {
                String[] w = rest.split("\\s+");
                if (w.length != 2) {
                    throw error(ln, "'equipment' needs 'ID-TEMPLATE Class', e.g. 'equipment FCU-{floor}-{unit} "
                            + "Fan_Coil_Unit' (no spaces in the id template)");
                }
                if (r.equipment.isPresent()) {
                    throw error(ln, "a second 'equipment' line in rule '" + r.id + "'");
                }
                Template t = template(ln, w[0]);
                r.templates.add(Map.entry(t, ln));
                r.equipment = Optional.of(new Rule.EquipmentSpec(t, classRef(ln, w[1], r)));
            }
            case "part" -> {
                Rule.PartSpec p = part(ln, rest, r);
                r.templates.add(Map.entry(p.id(), ln));
                r.parts.add(p);
            }
            case "location", "feeds", "fed-by" -> {
                String[] w = rest.split("\\s+");
                if (w.length != 2) {
                    throw error(ln, "'" + keyword + "' needs 'Class ID-TEMPLATE', e.g. '" + keyword
                            + (keyword.equals("location") ? " Floor F{floor}'" : " Chilled_Water_Loop CHW-1'"));
                }
                Template t = template(ln, w[1]);
                r.templates.add(Map.entry(t, ln));
                Rule.LinkSpec link = new Rule.LinkSpec(classRef(ln, w[0], r), t);
                (keyword.equals("location") ? r.locations : keyword.equals("feeds") ? r.feeds : r.fedBy).add(link);
            }
            case "unit" -> r.unit = once(ln, r.unit, unit(ln, rest), "unit");
            case "unit-for" -> {
                String[] w = rest.split("\\s+");
                if (w.length != 2) {
                    throw error(ln, "'unit-for' needs 'Tag UNIT', e.g. 'unit-for Temperature DEG_F'");
                }
                r.unitDefaults.add(Map.entry(tag(ln, w[0]), unit(ln, w[1])));
            }
            case "airflow" -> {
                String[] w = rest.split("\\s+");
                if (w.length != 2) {
                    throw error(ln, "'airflow' needs 'VALUE UNIT', e.g. 'airflow 400 FT3-PER-MIN' or "
                            + "'airflow {cfm} L-PER-SEC'");
                }
                String u = unit(ln, w[1]);
                if (!u.equals("FT3-PER-MIN") && !u.equals("L-PER-SEC") && !u.equals("M3-PER-HR")
                        && !u.equals("M3-PER-SEC")) {
                    throw error(ln, "airflow unit '" + w[1] + "' is not a volume flow; use FT3-PER-MIN, "
                            + "L-PER-SEC, M3-PER-HR or M3-PER-SEC");
                }
                Template v = template(ln, w[0]);
                if (v.slots().isEmpty() && w[0].matches("[-+]?\\d+(\\.\\d+)?")
                        && !(Double.parseDouble(w[0]) > 0)) {
                    throw error(ln, "airflow value '" + w[0] + "' is " + (w[0].startsWith("-") ? "negative" : "zero")
                            + "; a nominal airflow is a positive volume flow: write e.g. 400 or 188.8");
                }
                if (v.slots().isEmpty() && !w[0].matches("\\+?\\d+(\\.\\d+)?")) {
                    throw error(ln, "airflow value '" + w[0] + "' is not a number; write e.g. 400 or 188.8");
                }
                r.templates.add(Map.entry(v, ln));
                r.airflow = once(ln, r.airflow, new Rule.AirflowSpec(v, u), "airflow");
            }
            case "compete" -> {
                if (!rest.matches("[A-Za-z0-9_.\\-]+")) {
                    throw error(ln, "'compete' needs one group name (letters, digits, '_', '-', '.')");
                }
                r.compete = once(ln, r.compete, rest, "compete");
            }
            case "abbr" -> r.abbreviations.addAll(abbreviation(ln, rest));
            case "strip" -> r.strip.add(regex(ln, rest));
            case "expect" -> expect(ln, rest);
            default -> {
                if (TOP_KEYWORDS.contains(keyword)) {
                    throw error(ln, "'" + keyword + "' is not a rule line: start it at the beginning of the line "
                            + "(it then ends rule '" + r.id + "')");
                }
                throw error(ln, "unknown rule keyword '" + keyword + "'" + suggest(keyword, RULE_KEYWORDS)
                        + "; rule lines start with one of " + String.join(", ", RULE_KEYWORDS));
            }
        }
    }

    private <T> Optional<T> once(int ln, Optional<T> old, T value, String what) {
        if (old.isPresent()) {
            throw error(ln, "a second '" + what + "' line in the same rule; keep one");
        }
        return Optional.of(value);
    }

    /**
     * One {@code abbr} line: a phrase of one or more tokens and its tags; with {@code = -} every token listed is
     * ignored on its own ({@code abbr PGM DAC UIP = -} ignores three tokens).
     */
    private List<Dictionary.Entry> abbreviation(int ln, String rest) {
        int eq = rest.lastIndexOf('=');
        if (eq < 0) {
            throw error(ln, "'abbr' needs 'TOKEN... = Tag Tag...' (or 'TOKEN... = -' to ignore the tokens)");
        }
        List<String> key = Tokenizer.keys(rest.substring(0, eq));
        if (key.isEmpty()) {
            throw error(ln, "'abbr' has no token before '='");
        }
        List<String> tags = tagList(ln, rest.substring(eq + 1));
        if (tags.isEmpty()) {
            List<Dictionary.Entry> out = new ArrayList<>();
            for (String k : key) {
                out.add(new Dictionary.Entry(List.of(k), List.of(), ln));
            }
            return out;
        }
        return List.of(new Dictionary.Entry(key, tags, ln));
    }

    /** {@code table NAME KEY=Class KEY=Class ...}: classes by key, for TABLE[{group}] in class positions. */
    private void table(int ln, String rest) {
        String[] w = rest.split("\\s+");
        if (w.length < 2 || !w[0].matches("[A-Za-z][A-Za-z0-9_\\-]*") || w[0].contains("=")) {
            throw error(ln, "'table' needs 'NAME KEY=Class KEY=Class ...', e.g. 'table FANS SF=Supply_Fan "
                    + "RF=Return_Fan'");
        }
        Map<String, String> entries = tables.computeIfAbsent(w[0], k -> new TreeMap<>());
        tableLines.putIfAbsent(w[0], ln);
        for (int i = 1; i < w.length; i++) {
            int eq = w[i].indexOf('=');
            if (eq <= 0 || eq == w[i].length() - 1) {
                throw error(ln, "table entry '" + w[i] + "' should be KEY=Class (no spaces around '=')");
            }
            String key = w[i].substring(0, eq).toUpperCase(Locale.ROOT);
            String cls = brickClass(ln, w[i].substring(eq + 1));
            String before = entries.put(key, cls);
            if (before != null && !before.equals(cls)) {
                throw error(ln, "table " + w[0] + " gives key '" + w[i].substring(0, eq) + "' two classes ("
                        + before + ", " + cls + "); keep one");
            }
        }
    }

    /** A class position: a Brick class, or TABLE[{group}] (a table declared above). */
    private ClassRef classRef(int ln, String word, RuleBuilder r) {
        Matcher m = TABLE_REF.matcher(word);
        if (m.matches() && !word.contains(":")) {
            Map<String, String> entries = tables.get(m.group(1));
            if (entries == null) {
                throw error(ln, "no table '" + m.group(1) + "' above this line; declare it first with 'table "
                        + m.group(1) + " KEY=Class ...'" + suggest(m.group(1), List.copyOf(tables.keySet())));
            }
            Template key = template(ln, m.group(2));
            if (r != null) {
                r.templates.add(Map.entry(key, ln));
            }
            return ClassRef.lookup(m.group(1), key, entries);
        }
        return ClassRef.of(brickClass(ln, word));
    }

    private List<String> tagList(int ln, String text) {
        String t = text.strip();
        if (t.equals("-")) {
            return List.of();
        }
        if (t.isEmpty()) {
            throw error(ln, "no tags after '='; list Brick tags, or write '-' for none");
        }
        List<String> out = new ArrayList<>();
        for (String w : t.split("[\\s,]+")) {
            out.add(tag(ln, w));
        }
        return out;
    }

    private String tag(int ln, String word) {
        String name = BrickVocabulary.tagName(word);
        if (vocabulary.isTag(name)) {
            return name;
        }
        Optional<String> ci = vocabulary.tagIgnoringCase(name);
        if (ci.isPresent()) {
            return ci.get();
        }
        throw error(ln, vocabulary.unknownTagMessage(name) + "; pass --vocabulary with a newer Brick file if the "
                + "tag is real");
    }

    /**
     * A class name checked against the vocabulary. A class Brick deprecated in favour of another Brick class is
     * replaced by it, with a warning (Brick 1.3.0 swapped supply/return for leaving/entering on water points; 1.3.0
     * replaced Zone_Air_Temperature_Setpoint by Target_Zone_Air_Temperature_Setpoint); one whose replacement lies
     * outside Brick (1.4.0: Floor -> rec:Level) is kept, and the warning says how to write the replacement.
     */
    private String brickClass(int ln, String word) {
        if (vocabulary.isReplacementClass(word)) {
            return org.tufa.vocabulary.Namespaces.compact(word).orElse(word);
        }
        String name = BrickVocabulary.className(word);
        if (!vocabulary.isClass(name)) {
            String extra = name.contains(":") ? "; classes outside Brick that can be written: "
                    + String.join(", ", vocabulary.replacementClasses()) : "";
            throw error(ln, vocabulary.unknownClassMessage(name) + extra + "; pass --vocabulary with a newer Brick "
                    + "file if the class is real");
        }
        Optional<org.tufa.vocabulary.Deprecation> dep = vocabulary.deprecation(name);
        if (dep.isEmpty()) {
            return name;
        }
        String version = dep.get().version().isEmpty() ? "" : " in Brick " + dep.get().version();
        Optional<String> current = vocabulary.current(name);
        if (current.isPresent()) {
            warnings.add(fileName + ":" + ln + ": class " + name + " is deprecated" + version + "; written as "
                    + current.get() + " (its replacement)");
            return current.get();
        }
        String replacement = org.tufa.vocabulary.Namespaces.compact(dep.get().replacementIri())
                .orElse(dep.get().replacementIri());
        warnings.add(fileName + ":" + ln + ": class " + name + " is deprecated" + version
                + (replacement.isEmpty() ? "" : "; write " + replacement + " to follow Brick") + "; accepted as written");
        return name;
    }

    private String unit(int ln, String word) {
        // export spellings ("degF", "%", "cfm") map to QUDT names; anything else must look like a QUDT name
        Optional<String> spelled = ExportUnits.toQudt(word);
        if (spelled.isPresent()) {
            return spelled.get();
        }
        String w = word.startsWith("unit:") ? word.substring(5) : word;
        if (!UNIT_NAME.matcher(w).matches()) {
            throw error(ln, "'" + word + "' is not a QUDT unit name; write e.g. DEG_F, DEG_C, PERCENT, FT3-PER-MIN");
        }
        return org.tufa.vocabulary.QudtUnits.canonical(w).orElseThrow(() -> error(ln, "unknown QUDT unit '" + w
                + "' (QUDT 3.1.0 has no such unit); nearest: " + String.join(", ",
                org.tufa.vocabulary.QudtUnits.nearest(w)) + "; or write an export spelling such as degF, %, cfm"));
    }

    private Rule.PartSpec part(int ln, String rest, RuleBuilder r) {
        String[] w = rest.split("\\s+");
        if (w.length < 2 || w.length == 3 || w.length > 2 && !w[2].equals("when")) {
            throw error(ln, "'part' needs 'ID Class [when Tag...]', e.g. 'part CHWV Chilled_Water_Valve when "
                    + "Cool Valve'");
        }
        Template id = template(ln, w[0]);
        ClassRef cls = classRef(ln, w[1], r);
        Set<String> when = new TreeSet<>();
        for (int i = 3; i < w.length; i++) {
            when.add(tag(ln, w[i]));
        }
        return new Rule.PartSpec(id, cls, when, ln);
    }

    private Pattern regex(int ln, String text) {
        try {
            return Pattern.compile(text);
        } catch (PatternSyntaxException e) {
            throw error(ln, "invalid regular expression: " + e.getDescription() + " at position " + e.getIndex()
                    + " of '" + text + "'; fix the pattern (Java regex syntax)");
        }
    }

    private Template template(int ln, String text) {
        try {
            return Template.parse(text);
        } catch (IllegalArgumentException e) {
            throw error(ln, e.getMessage());
        }
    }

    private void expect(int ln, String rest) {
        List<String> w;
        try {
            w = QuotedWords.split(rest);
        } catch (IllegalArgumentException e) {
            throw error(ln, e.getMessage());
        }
        int arrow = w.indexOf("=>");
        if (w.isEmpty() || arrow < 1 || arrow == w.size() - 1) {
            throw error(ln, "'expect' needs 'NAME [description TEXT] [units U] [type T] [device D] => Class "
                    + "[on EQUIPMENT] [part PART]' (quote a name with spaces)");
        }
        Map<String, String> fields = new LinkedHashMap<>();
        for (int i = 1; i < arrow; i += 2) {
            String k = w.get(i);
            if (!Set.of("description", "units", "type", "device", "series").contains(k) || i + 1 >= arrow) {
                throw error(ln, "in 'expect', '" + k + "' should be description, units, type, device or series, "
                        + "followed by a value");
            }
            fields.put(k, w.get(i + 1));
        }
        String cls = brickClass(ln, w.get(arrow + 1));
        Optional<String> equipment = Optional.empty();
        Optional<String> part = Optional.empty();
        for (int i = arrow + 2; i < w.size(); i += 2) {
            String k = w.get(i);
            if (i + 1 >= w.size() || !(k.equals("on") || k.equals("part"))) {
                throw error(ln, "in 'expect', after the class write 'on EQUIPMENT' and/or 'part PART'");
            }
            if (k.equals("on")) {
                equipment = Optional.of(w.get(i + 1));
            } else {
                part = Optional.of(w.get(i + 1));
            }
        }
        String rawType = fields.getOrDefault("type", "");
        String type = rawType.isEmpty() ? "" : ObjectTypes.normalise(rawType).orElseThrow(() -> error(ln,
                "'" + rawType + "' is not a BACnet object type; use one of " + ObjectTypes.KNOWN));
        PointRecord sample = new PointRecord(ln, w.get(0), fields.getOrDefault("description", ""),
                fields.getOrDefault("units", ""), type, rawType, fields.getOrDefault("device", ""),
                fields.getOrDefault("series", ""), new TreeMap<>());
        expectations.add(new Expectation(fileName + ":" + ln, sample, cls, equipment, part));
    }

    private InputException error(int ln, String message) {
        return InputException.at(file, ln, message);
    }

    private static String suggest(String word, List<String> known) {
        List<String> near = NameSuggester.nearest(word, known, 1);
        return near.isEmpty() ? "" : " (did you mean '" + near.get(0) + "'?)";
    }

    private static int indexOfWhitespace(String s) {
        for (int i = 0; i < s.length(); i++) {
            if (Character.isWhitespace(s.charAt(i))) {
                return i;
            }
        }
        return -1;
    }

    private static String stripTrailing(String s) {
        return s.stripTrailing();
    }

    /** Named groups of a pattern, in order of appearance. */
    static Set<String> groupNames(Pattern p) {
        Set<String> out = new java.util.LinkedHashSet<>();
        Matcher m = GROUP_NAME.matcher(p.pattern());
        while (m.find()) {
            out.add(m.group(1));
        }
        return out;
    }

    /**
     * Text every string the pattern matches must start with, when the pattern is anchored with '^' and begins
     * with literal characters; empty when that cannot be read off safely (top-level '|', flags, no anchor).
     */
    public static Optional<String> literalPrefix(Pattern p) {
        String s = p.pattern();
        if (p.flags() != 0 || !s.startsWith("^") || hasTopLevelAlternation(s)) {
            return Optional.empty();
        }
        StringBuilder b = new StringBuilder();
        int i = 1;
        while (i < s.length()) {
            char c = s.charAt(i);
            char lit;
            int next;
            if (c == '\\') {
                if (i + 1 >= s.length()) {
                    break;
                }
                char e = s.charAt(i + 1);
                if (Character.isLetterOrDigit(e)) {
                    break;
                }
                lit = e;
                next = i + 2;
            } else if (".[]()|*+?{}^$".indexOf(c) >= 0) {
                break;
            } else {
                lit = c;
                next = i + 1;
            }
            if (next < s.length() && "?*{".indexOf(s.charAt(next)) >= 0) {
                break;
            }
            b.append(lit);
            if (next < s.length() && s.charAt(next) == '+') {
                break;
            }
            i = next;
        }
        return b.length() == 0 ? Optional.empty() : Optional.of(b.toString());
    }

    private static boolean hasTopLevelAlternation(String s) {
        int depth = 0;
        boolean inClass = false;
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            if (c == '\\') {
                i++;
            } else if (inClass) {
                if (c == ']') {
                    inClass = false;
                }
            } else if (c == '[') {
                inClass = true;
            } else if (c == '(') {
                depth++;
            } else if (c == ')') {
                depth--;
            } else if (c == '|' && depth == 0) {
                return true;
            }
        }
        return false;
    }

    /** Collects one rule's lines, then checks and freezes it. */
    private final class RuleBuilder {
        final String id;
        final int line;
        final int index;
        final List<Rule.FieldMatch> matches = new ArrayList<>();
        final List<Pattern> strip = new ArrayList<>();
        final Set<String> types = new TreeSet<>();
        Optional<ClassRef> pointClass = Optional.empty();
        Template tagSource = Template.parse("{name}");
        int classLine;
        final List<String> extraTags = new ArrayList<>();
        Optional<Rule.EquipmentSpec> equipment = Optional.empty();
        final List<Rule.PartSpec> parts = new ArrayList<>();
        final List<Rule.LinkSpec> locations = new ArrayList<>();
        final List<Rule.LinkSpec> feeds = new ArrayList<>();
        final List<Rule.LinkSpec> fedBy = new ArrayList<>();
        Optional<String> unit = Optional.empty();
        final List<Map.Entry<String, String>> unitDefaults = new ArrayList<>();
        Optional<Rule.AirflowSpec> airflow = Optional.empty();
        Optional<String> compete = Optional.empty();
        final List<Dictionary.Entry> abbreviations = new ArrayList<>();
        final List<Map.Entry<Template, Integer>> templates = new ArrayList<>();

        RuleBuilder(String id, int line, int index) {
            this.id = id;
            this.line = line;
            this.index = index;
        }

        Rule build(Dictionary fileDictionary) {
            if (matches.stream().noneMatch(m -> !m.negated()
                    && (m.field() == Rule.Field.NAME || m.field() == Rule.Field.DESCRIPTION))) {
                throw error(line, "rule '" + id + "' has no 'match name REGEX' or 'match description REGEX' line; "
                        + "add one so the rule knows which points it takes");
            }
            Set<String> groups = new java.util.LinkedHashSet<>();
            for (Rule.FieldMatch m : matches) {
                groups.addAll(m.groups());
            }
            for (Map.Entry<Template, Integer> t : templates) {
                for (String slot : t.getKey().slots()) {
                    if (!groups.contains(slot) && !BUILT_INS.contains(slot)) {
                        throw error(t.getValue(), "template '" + t.getKey().source() + "' names group '" + slot
                                + "', which rule '" + id + "' does not define; its groups: "
                                + (groups.isEmpty() ? "(none)" : String.join(", ", groups))
                                + "; built-ins: description, device, name, series, type, units");
                    }
                }
            }
            if (equipment.isEmpty() && (!parts.isEmpty() || !feeds.isEmpty() || !fedBy.isEmpty()
                    || airflow.isPresent())) {
                throw error(line, "rule '" + id + "' has parts, feeds or airflow but no 'equipment' line; add the "
                        + "equipment they belong to (a location alone is fine: the points are then put there)");
            }
            Set<String> seen = new HashSet<>();
            for (Rule.PartSpec p : parts) {
                if (!seen.add(p.id().source() + " " + String.join(" ", p.when()))) {
                    throw error(p.line(), "part '" + p.id().source() + "' is declared twice in rule '" + id + "'");
                }
            }
            Dictionary dict = abbreviations.isEmpty() ? fileDictionary : Dictionary.of(abbreviations, fileDictionary);
            String label = fileName + ":" + line;
            // every positive name pattern must match, so any one's literal prefix filters: take the longest
            Optional<String> prefix = matches.stream().filter(m -> !m.negated() && m.field() == Rule.Field.NAME)
                    .map(m -> literalPrefix(m.pattern())).flatMap(Optional::stream)
                    .max(java.util.Comparator.comparingInt(String::length));
            List<Pattern> strips = new ArrayList<>(strip);
            strips.addAll(RuleFileParser.this.strip);
            return new Rule(id, label, index, List.copyOf(matches), Set.copyOf(types), pointClass, tagSource,
                    List.copyOf(extraTags), equipment, List.copyOf(parts), List.copyOf(locations), List.copyOf(feeds),
                    List.copyOf(fedBy), unit, List.copyOf(unitDefaults), airflow, compete, dict, List.copyOf(strips),
                    prefix);
        }
    }

    /** Lower-case keyword check used by tests. */
    static boolean isKeyword(String w) {
        return TOP_KEYWORDS.contains(w.toLowerCase(Locale.ROOT)) || RULE_KEYWORDS.contains(w.toLowerCase(Locale.ROOT));
    }
}
