package dev.nanoplan.engine;

/** An engine could not start or lost its cluster; the message is one line for the user. */
public final class EngineUnavailableException extends RuntimeException {

    private static final long serialVersionUID = 1L;

    /** @param message one line naming what could not be reached and why */
    public EngineUnavailableException(String message, Throwable cause) {
        super(message, cause);
    }
}
