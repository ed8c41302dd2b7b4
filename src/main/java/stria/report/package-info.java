/**
 * Reads finished TSV results back (one file or the parts of one genome's results), summarises them per
 * contig and for the genome, and writes the summary as TSV or as one self-contained HTML page with charts.
 * Nothing here looks at sequence: everything comes from the result rows and their {@code #} header.
 *
 * <p>Reading ({@link stria.report.ResultReader} into a {@link stria.report.ResultSet}), summing
 * ({@link stria.report.Summary}) and the data of each chart (bins, series and tables: {@code PeriodHistogram},
 * {@code MotifRanking}, {@code ContigShares}, {@code RepeatDensity}, {@code LengthHistogram},
 * {@code LengthPurityGrid}) are plain computations on primitive arrays, tested without a drawing library.
 * Only {@code Charts} (one method per chart) and {@code ChartStyle} (the one look they share) draw, with
 * JFreeChart into SVG; {@link stria.report.HtmlReport} lays out the page around them.
 *
 * <p>May use: the JDK, JFreeChart and JFreeSVG (in the drawing only), {@code stria.out} for the result
 * header and atomic files, and {@link stria.StriaException}. Nothing of the scan (io, pipeline, engine,
 * scorer): a report is made from result files alone.
 */
package stria.report;
