/**
 * Text indexes over a stretch of small-alphabet codes: the suffix array (SA-IS), the LCP array (Kasai,
 * Phi), and both truncated at a depth ({@link stria.index.ShallowSuffixArray}) for short periods. The engine
 * builds them per window, with workspaces kept by the caller between windows.
 *
 * <p>May use: the JDK only. Works on primitive arrays of codes and knows nothing of FASTA, contigs or
 * repeats, so it can be tested against brute force on any string.
 */
package stria.index;
