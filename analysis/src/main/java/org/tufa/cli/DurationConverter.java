package org.tufa.cli;

import java.time.Duration;
import java.time.format.DateTimeParseException;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import picocli.CommandLine;

/**
 * Reads a duration option: ISO 8601 ({@code PT15M}, {@code PT1H}, {@code P1D}) or the short forms people type
 * ({@code 15min}, {@code 15m}, {@code 90s}, {@code 1h}, {@code 2d}). Anything else is a one-line error that shows
 * both forms.
 */
final class DurationConverter implements CommandLine.ITypeConverter<Duration> {

    private static final Pattern SHORT = Pattern.compile("(\\d+)\\s*(s|sec|secs|second|seconds|m|min|mins|minute|minutes"
            + "|h|hr|hrs|hour|hours|d|day|days)");

    @Override
    public Duration convert(String value) {
        String text = value.strip();
        try {
            return Duration.parse(text);
        } catch (DateTimeParseException e) {
            // try the short forms below
        }
        Matcher m = SHORT.matcher(text.toLowerCase(Locale.ROOT));
        if (m.matches() && m.group(1).length() <= 9) {
            long n = Long.parseLong(m.group(1));
            return switch (m.group(2).charAt(0)) {
                case 's' -> Duration.ofSeconds(n);
                case 'm' -> Duration.ofMinutes(n);
                case 'h' -> Duration.ofHours(n);
                default -> Duration.ofDays(n);
            };
        }
        throw new CommandLine.TypeConversionException("'" + org.tufa.common.Printable.excerpt(value)
                + "' is not a duration; write it in ISO 8601 (PT15M, PT1H) or as 15min, 1h, 90s");
    }
}
