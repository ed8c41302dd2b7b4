/**
 * Reads finished TSV results back (one file or the parts of one genome's results), summarises them per
 * contig and for the genome, and writes the summary as TSV or as one self-contained HTML page with charts.
 * Nothing here looks at sequence: everything comes from the result rows and their {@code #} header.
 */
package stria.report;
