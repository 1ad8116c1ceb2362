package dev.nanoplan.cli;

/** Bad input from the user: printed as one line, exit status 2. */
public final class BadInputException extends RuntimeException {

    public BadInputException(String message) {
        super(message);
    }
}
