/**
 * A first cause classifier trained on the labelled data of reviewed units ({@code tufa labels}): a random forest
 * (Breiman, "Random forests", Machine Learning 45, 2001; Smile's implementation) on each sample's shift from its
 * unit's normal operation, its leave-one-unit-out check, and the diagnosed cause of each finding, always a candidate
 * for qualified staff to verify.
 */
package org.tufa.analysis.diagnose;
