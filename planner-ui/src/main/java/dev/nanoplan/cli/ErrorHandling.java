package dev.nanoplan.cli;

import dev.nanoplan.engine.EngineUnavailableException;
import picocli.CommandLine;

/** Maps failures to one-line messages and the exit statuses of docs/architecture.md §4.2. */
final class ErrorHandling {

    static final int BAD_INPUT = 2;
    static final int INTERNAL = 1;

    private ErrorHandling() {
    }

    static String oneLine(String s) {
        if (s == null || s.isBlank()) {
            return "unknown error";
        }
        return s.strip().replace("\r", "").replace("\n", "; ");
    }

    /** Usage errors: message plus a hint, never a stack trace. */
    static final class ParameterErrors implements CommandLine.IParameterExceptionHandler {
        @Override
        public int handleParseException(CommandLine.ParameterException ex, String[] args) {
            CommandLine cl = ex.getCommandLine();
            String own = OptionForms.message(ex);
            cl.getErr().println("nanoplan: " + oneLine(own != null ? own : ex.getMessage()));
            cl.getErr().println("(see: " + cl.getCommandSpec().qualifiedName() + " --help)");
            cl.getErr().flush();
            return BAD_INPUT;
        }
    }

    /** Failures while running: bad input → 2, anything else → 1; one line each. */
    static final class ExecutionErrors implements CommandLine.IExecutionExceptionHandler {
        @Override
        public int handleExecutionException(Exception ex, CommandLine cl, CommandLine.ParseResult parseResult) {
            boolean bad = ex instanceof BadInputException || ex instanceof IllegalArgumentException
                    || ex instanceof CommandLine.ParameterException;
            String msg = bad || ex instanceof EngineUnavailableException ? oneLine(ex.getMessage())
                    : "internal error: " + ex.getClass().getSimpleName() + ": " + oneLine(ex.getMessage());
            cl.getErr().println("nanoplan: " + msg);
            cl.getErr().flush();
            return bad ? BAD_INPUT : INTERNAL;
        }
    }
}
