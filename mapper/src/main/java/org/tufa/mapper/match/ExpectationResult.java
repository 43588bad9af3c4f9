package org.tufa.mapper.match;

import org.tufa.mapper.rules.Expectation;

/** An inline expectation and whether it held; {@code actual} says what the rules produced instead. */
public record ExpectationResult(Expectation expectation, boolean passed, String actual) {
}
