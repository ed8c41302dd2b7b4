package stria.out;

import htsjdk.samtools.util.BlockCompressedInputStream;
import java.io.BufferedInputStream;
import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.Charset;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.zip.GZIPInputStream;
import stria.StriaException;
import stria.io.Compression;

/**
 * A result file read line by line (by merge and report): plain, gzip or BGZF, told apart by content, or
 * standard input for {@code -}. Every failure, a damaged compressed block included, is a
 * {@link StriaException} that names the file.
 */
public final class ResultInput implements AutoCloseable {
    /**
     * A BGZF block whose ISIZE field is damaged makes the library's decompressor allocate up to 2 GB; valid
     * blocks hold at most 64 KB.
     */
    private static final String HUGE_BLOCK = "a compressed block claims more data than memory holds; the file is"
            + " most likely damaged (check it with 'gzip -t')";

    private final String name;
    private final BufferedReader in;
    private final char[] buf = new char[1 << 16];
    private int pos;
    private int lim;
    private final StringBuilder line = new StringBuilder(256);

    private ResultInput(String name, BufferedReader in) {
        this.name = name;
        this.in = in;
    }

    /**
     * Opens {@code path} ({@code -} for standard input, which is never closed) as text in {@code charset}.
     *
     * @throws StriaException when it cannot be opened
     */
    public static ResultInput open(String path, Charset charset) {
        try {
            InputStream raw = path.equals("-") ? System.in : Files.newInputStream(Path.of(path));
            BufferedInputStream buffered = new BufferedInputStream(raw, 1 << 16);
            InputStream text;
            try {
                text = switch (Compression.of(buffered)) {
                    case PLAIN -> buffered;
                    case GZIP -> new GZIPInputStream(buffered, 1 << 16);
                    case BGZF -> new BlockCompressedInputStream(buffered);
                };
            } catch (IOException | RuntimeException e) {
                buffered.close();
                throw e;
            }
            return new ResultInput(path, new BufferedReader(new InputStreamReader(text, charset), 1 << 16));
        } catch (IOException | RuntimeException e) {
            throw failure(path, e);
        } catch (OutOfMemoryError e) {
            throw new StriaException("cannot read " + path + ": " + HUGE_BLOCK);
        }
    }

    /**
     * The next line without its line end, or null at the end of the file. Lines end at a line feed only
     * (one carriage return before it is dropped): a lone carriage return, which stria never writes, stays in
     * the line, so a damaged line end is seen as damage rather than read as two lines.
     */
    public String readLine() {
        try {
            line.setLength(0);
            while (true) {
                if (pos == lim) {
                    int n = in.read(buf);
                    if (n < 0) {
                        return line.isEmpty() ? null : line.toString();
                    }
                    pos = 0;
                    lim = n;
                }
                int i = pos;
                while (i < lim && buf[i] != '\n') {
                    i++;
                }
                line.append(buf, pos, i - pos);
                if (i < lim) {
                    pos = i + 1;
                    int len = line.length();
                    if (len > 0 && line.charAt(len - 1) == '\r') {
                        line.setLength(len - 1);
                    }
                    return line.toString();
                }
                pos = lim;
            }
        } catch (IOException | RuntimeException e) {
            // a damaged BGZF part can fail inside the library's decompressor with an index error
            throw failure(name, e);
        } catch (OutOfMemoryError e) {
            throw new StriaException("cannot read " + name + ": " + HUGE_BLOCK);
        }
    }

    private static StriaException failure(String path, Exception e) {
        return e instanceof StriaException s ? s : StriaException.io("cannot read " + path, e);
    }

    @Override
    public void close() {
        if (name.equals("-")) {
            return;
        }
        try {
            in.close();
        } catch (IOException e) {
            // reading is over; closing cannot lose anything
        }
    }
}
