package org.tufa.analysis.coverage;

/** The outcome of looking for a role's point on one unit. */
public enum MatchStatus {
    /** Exactly one point qualified at the first place that had any. */
    FOUND,
    /** No point qualified anywhere the role looks. */
    MISSING,
    /** Several points qualified at the same place and precedence; the model must say which one is meant. */
    AMBIGUOUS
}
