package dev.nanoplan.cli;

import java.math.BigDecimal;
import picocli.CommandLine;
import picocli.CommandLine.ITypeConverter;
import picocli.CommandLine.Model.ArgSpec;
import picocli.CommandLine.Model.OptionSpec;
import picocli.CommandLine.TypeConversionException;

/**
 * Reading option values in the user's words: whole numbers may be written as {@code 1e6} when they are
 * whole, and a value that does not read names the option and the expected form
 * ({@code --molecules: whole number, e.g. 1000000, got '1.5'}).
 */
final class OptionForms {

    private OptionForms() {
    }

    /** Registers the whole-number converters on {@code cl} (they apply to every subcommand added later). */
    static void register(CommandLine cl) {
        cl.registerConverter(Long.class, OptionForms::wholeLong);
        cl.registerConverter(Long.TYPE, OptionForms::wholeLong);
        cl.registerConverter(Integer.class, OptionForms::wholeInt);
        cl.registerConverter(Integer.TYPE, OptionForms::wholeInt);
    }

    /** A whole number, in plain or scientific notation ({@code 1e6}), that fits a long. */
    static Long wholeLong(String text) {
        BigDecimal v = decimal(text);
        try {
            return v.longValueExact();
        } catch (ArithmeticException e) {
            throw new TypeConversionException("not a whole number in range");
        }
    }

    /** As {@link #wholeLong} for an int. */
    static Integer wholeInt(String text) {
        BigDecimal v = decimal(text);
        try {
            return v.intValueExact();
        } catch (ArithmeticException e) {
            throw new TypeConversionException("not a whole number in range");
        }
    }

    private static BigDecimal decimal(String text) {
        try {
            return new BigDecimal(text.strip().replace("_", ""));
        } catch (NumberFormatException e) {
            throw new TypeConversionException("not a number");
        }
    }

    /** The expected form of a value of {@code arg}, with an example, e.g. "whole number, e.g. 1000000". */
    static String expected(ArgSpec arg) {
        Class<?> t = arg.type();
        Class<?> item = t.isArray() ? t.getComponentType() : t;
        boolean whole = item == long.class || item == Long.class || item == int.class || item == Integer.class;
        boolean real = item == double.class || item == Double.class;
        if (t.isArray() && whole) {
            return "comma-separated whole numbers, e.g. 0,500,1000";
        }
        if (t.isArray() && real) {
            return "comma-separated numbers, e.g. 0.12,0.03,0.01";
        }
        if (whole) {
            return "whole number, e.g. 1000000";
        }
        if (real) {
            return "number, e.g. 0.3 or 1e-3";
        }
        return "a value of the form " + arg.paramLabel();
    }

    /** The option's long name, or the positional parameter's label. */
    static String name(ArgSpec arg) {
        return arg instanceof OptionSpec o ? o.longestName() : arg.paramLabel();
    }

    /**
     * The one-line message for a parse error, in the user's words when the error is a value that did not
     * read; null to keep picocli's own message.
     */
    static String message(CommandLine.ParameterException ex) {
        ArgSpec arg = ex.getArgSpec();
        String value = ex.getValue();
        String m = ex.getMessage();
        if (arg == null || value == null || m == null || !m.startsWith("Invalid value for")) {
            return null;
        }
        return name(arg) + ": " + expected(arg) + ", got '" + value + "'";
    }
}
