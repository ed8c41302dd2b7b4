/**
 * Genome input, the first stage of the pipeline: FASTA files (plain, gzip, BGZF with optional .fai and
 * .gzi, standard input and pipes) opened as a list of contigs whose bases are read front to back as
 * streams ({@link stria.io.BaseStream}), in pieces of any size, every byte checked on the way; and the
 * region strings people type ({@link stria.io.Region}). Everything after this stage may assume clean
 * IUPAC letters; {@link stria.io.Bases} gives the codes every stage shares.
 *
 * <p>No contig is held in memory here: {@link stria.io.GenomeReader} keeps one cursor over the
 * decompressed file and, per record, where its sequence starts and its {@link stria.io.LineLayout}, so a
 * stream can also start in the middle of a record. Holding bases (an array, or a temporary file for a long
 * contig) is the pipeline's business, behind {@link stria.io.ContigBytes}.
 *
 * <p>May use: the JDK, htsjdk (decompression, BGZF, .fai and .gzi) and {@link stria.StriaException}. No
 * other stria package: every later stage depends on this one, never the reverse.
 */
package stria.io;
