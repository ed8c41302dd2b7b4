package stria.cli;

import picocli.CommandLine;

/**
 * The one reading of a decimal option value, registered for every command ({@link Main#commandLine}): a
 * finite number or a usage error. {@code NaN}, {@code Infinity} and values too large for a double (such as
 * {@code 1e309}, which Java reads as infinity) would otherwise pass every range check written as a
 * comparison, or fail later with an internal error.
 */
final class FiniteNumber implements CommandLine.ITypeConverter<Double> {
    @Override
    public Double convert(String text) {
        double v;
        try {
            v = Double.parseDouble(text.strip());
        } catch (NumberFormatException e) {
            throw new CommandLine.TypeConversionException("'" + text + "' is not a number");
        }
        if (!Double.isFinite(v)) {
            throw new CommandLine.TypeConversionException("'" + text + "' is not a finite number");
        }
        // "0x1p3" and "1d" are Java syntax, not what a user means by a number
        if (!text.strip().matches("[+-]?(\\d+\\.?\\d*|\\.\\d+)([eE][+-]?\\d+)?")) {
            throw new CommandLine.TypeConversionException("'" + text + "' is not a decimal number");
        }
        return v;
    }
}
