package stria.report;

import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import stria.testutil.ResultFixtures;

/** Writes preview reports to a directory, for looking at them by eye: java ... ReportPreview DIR. */
final class ReportPreview {
    public static void main(String[] args) throws Exception {
        Path dir = Path.of(args[0]);
        Files.createDirectories(dir);
        for (int n : new int[] {1, 300}) {
            Path tsv = ResultFixtures.genome(dir.resolve("g" + n + ".tsv"), n, 7);
            ResultSet r = ResultReader.read(List.of(tsv.toString()));
            try (OutputStream os = Files.newOutputStream(dir.resolve("g" + n + ".html"))) {
                HtmlReport.write(r, Summary.of(r), os);
            }
        }
    }
}
