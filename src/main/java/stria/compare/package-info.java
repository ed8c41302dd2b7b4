/**
 * Comparison of two assemblies: which tandem repeats of A have a different length in B. The engine
 * ({@link stria.compare.Comparison}) takes A's loci per contig with random access to A's bases, and B as
 * contigs streamed once front to back; it never holds either genome whole and does not depend on how the
 * scans were run. Uses {@code score.Locus} and the scorer's alignment scores, {@code io} for bases, and
 * {@code out.LocusFormat} for numbers. {@link stria.compare.GenomeComparison} runs a whole comparison on top
 * of the scan ({@code pipeline}); the writer, BED, summary and merge of parts ({@code CompareWriter},
 * {@code ChangedBed}, {@code CompareSummary}, {@code CompareMerge}) write to streams the caller opens and
 * read results through {@code out.ResultInput}; {@code report.PeriodClass} names the period classes.
 *
 * <h2>Anchors</h2>
 * A locus is found in B by the sequence beside it, never by coordinates, so B's contigs may be renamed,
 * split, joined, reverse-complemented or shifted by any indel. An anchor is a word of
 * {@value stria.compare.Kmer#K} bases (two bits a base in one long; odd, so no word is its own reverse
 * complement) keyed by its canonical form, the smaller of the word and its reverse complement, so it is
 * found on either strand. Only words whose hash falls in one of {@code sampling} (8) classes may anchor:
 * B streams past the index with one lookup per 8 bases instead of one per base. On each side of a locus the
 * anchors are the nearest sampled words, up to {@code anchorsPerSide} (6), each ending where the one
 * nearer the locus starts (one substitution spoils at most one), within {@code flank} (400) bases beside
 * the locus; they never overlap another locus of A (a word inside a repeat is rarely unique), and the
 * search passes over neighbouring loci (up to {@code maxSkip}, 20 kb) instead of stopping at them. Only
 * A, C, G, T lie between an anchor and its locus.
 *
 * <h2>Uniqueness and pairing</h2>
 * All anchor words sit in one hash table ({@link stria.compare.AnchorTable}). Every word of A, on both
 * strands, is counted against it, then every word of B; an anchor is usable when its word occurs exactly
 * once in A and exactly once in B. Pairing is therefore one-to-one: an anchor word names one place in A
 * and one in B. On each side of a locus the usable anchors vote: they are grouped by B contig, strand and
 * diagonal (B position minus A position, or plus on the reverse strand, within 32 bases, which absorbs
 * indels between anchors). The pair of groups, one per side, on the same contig and strand, in the order
 * that strand requires, no further apart than twice A's span plus 16 periods plus 4 kb, and with the most
 * anchors wins; its innermost anchors bound the stretch. A locus without such a pair is {@code unplaced},
 * with the reason in the note (an anchor missing in B, not unique in A or in B, the sides disagreeing as
 * at a split).
 *
 * <h2>Streaming B</h2>
 * B's bases pass through a ring long enough for the longest stretch a locus may claim. When a usable
 * word of the second side of a locus (in B's order: the left side first on the + strand, the right side
 * first on the - strand) comes by and words of the first side came by shortly before, B's bases from the
 * first of those on are kept for the locus, two bits a base ({@link stria.compare.KeptStretches}). Which
 * anchors are unique in B is known only at the end, so the stretch kept runs from the outermost anchors;
 * a word already seen twice in B neither starts nor ends one (a stretch it brought would replace the one
 * kept for unique words, and only B's order, not its content, would say which is left).
 *
 * <h2>Measurement</h2>
 * B's repeat length comes from B's own bases between the anchors. A's stretch between the same anchors
 * is kept (two bits a base) and compared with B's, read on A's strand:
 * <ul>
 *   <li>identical: the locus is {@code same}, at the same offset;
 *   <li>otherwise the two are walked from both ends while they stay in step (at most 4 of any 16 bases
 *       differ): after an insertion or deletion they fall out of step, so this bounds where every one
 *       lies. Substitutions only: same length. Every difference more than 64 bases before (after) the
 *       locus: the locus is unchanged and shifted (not shifted);
 *   <li>else a window around the locus and the differences is aligned end to end
 *       ({@link stria.compare.StretchAligner}, wraparound dynamic programming) against A's bases with the
 *       locus, and any neighbour that fits its own motif clearly better than the locus' one, as loops
 *       over their consensus motifs: each loop takes as many of B's bases as B's copy of that repeat
 *       holds, so extra copies of a neighbour stay with the neighbour. A's own window goes through the
 *       same template and the difference between where the aligner cuts A and where the scan did is
 *       carried over to B, so only a difference between the genomes shows;
 *   <li>a window of more than {@code maxCells} alignment cells is measured by length alone (flanks taken
 *       as unchanged; note {@code measured-by-length}).
 * </ul>
 * B's purity is A's purity moved by the difference between the two repeats aligned against A's motif, so
 * identical repeats show identical purity. Copies are length over A's period.
 *
 * <h2>Statuses</h2>
 * {@code same}: B's repeat has A's length. {@code changed}: it has another length. {@code lost}: both
 * anchors found, and B's repeat is shorter than A's and holds fewer than {@code minCopies} copies of A's
 * motif (nothing, or not a tandem repeat any more). {@code unplaced}: no pair of usable anchors. {@code new}:
 * a locus of B's own scan that overlaps no placed locus of A in B, nor the stretch around a usable anchor
 * of an unplaced one ({@link stria.compare.Comparison#newLoci}). {@link stria.compare.CompareRow} writes
 * the row, A's side first, {@code .} for absent values.
 *
 * <h2>Memory and time</h2>
 * Per locus, on human chromosome 20 (37,097 loci; 12 anchors a locus, 9.8 distinct words a locus): the
 * anchor table about 515 bytes (a slot 21 bytes at most 0.6 full, plus the anchors' references), A's
 * stretch and per-locus arrays about 310, B's kept stretch about 170; 993 bytes in all, besides the
 * caller's loci and the result rows (bench/compare.sh). Two million loci take about 2 GB. Counting A and
 * streaming B run at 60-90 MB/s on one core; pairing and measuring on several threads. Results do not
 * depend on thread count: each locus is decided alone from state fixed once B has streamed by.
 *
 * <h2>Known limits</h2>
 * A locus whose flanks are interspersed repeats within 400 bases on one side is unplaced (1.7 % of
 * chromosome 20 against itself), unless its contig of A has exactly one identical contig in B (and that one
 * in A): those keep every locus in place, so a genome compared with itself is {@code same} throughout. A
 * longer repeat in B far less pure than A's (more than 0.15 below; an insertion of unrelated sequence
 * beside it, which the loop takes more cheaply than flank) is {@code unplaced}, note
 * {@code repeat-unclear-in-B}. Two neighbouring loci whose motifs
 * fit each other's bases about equally (one imperfect array the scan split in two) keep their bases
 * apart: a change near or across their boundary may be credited to the wrong one, or to both.
 */
package stria.compare;
