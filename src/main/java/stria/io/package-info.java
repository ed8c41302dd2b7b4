/**
 * Genome input: FASTA files (plain, gzip, BGZF with optional .fai and .gzi, standard input) read into
 * one exactly sized byte array per contig or in pieces, every byte checked; and the region strings
 * people type.
 * The first stage of the pipeline: everything after it may assume clean IUPAC letters.
 */
package stria.io;
