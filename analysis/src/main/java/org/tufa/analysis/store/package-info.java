/**
 * Models kept in a triple store: a Jena TDB2 dataset in a folder, one named graph per building and the vocabulary
 * in a graph of its own ({@link org.tufa.analysis.store.ModelStore}), loaded by {@code tufa load}, read by
 * {@code coverage}, {@code query} and {@code analyze} with {@code --store}, and served read-only over the SPARQL
 * protocol by {@code tufa serve} ({@link org.tufa.analysis.store.StoreServer}).
 */
package org.tufa.analysis.store;
