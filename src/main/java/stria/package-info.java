/**
 * stria: the tandem repeats of genome assemblies. The packages follow the data: {@code io} (FASTA in) ->
 * {@code pipeline} (windows over the engine of {@code index} and {@code repeats}, loci from {@code score}) ->
 * {@code out} (BED, TSV, masked FASTA), with {@code shard} (split and merge), {@code report} (summaries of
 * results) and {@code cli} (the commands) at the edges.
 *
 * <p>This package holds what every floor shares and nothing else: {@link stria.StriaException}, the one
 * user-facing error, with the one translation of library I/O failures into it, and {@link stria.Intervals},
 * the union of intervals. It may use only the JDK (and htsjdk's exception type, to recognise it).
 */
package stria;
