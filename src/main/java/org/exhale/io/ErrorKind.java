package org.exhale.io;

/** The kinds of input error; tests assert the kind, not the wording. */
public enum ErrorKind {
    /** The file cannot be read or does not exist. */
    FILE_UNREADABLE,
    /** The file is empty or holds no data. */
    EMPTY_FILE,
    /** The file is not valid syntax for its format (YAML, CSV). */
    SYNTAX,
    /** A required key or column is missing. */
    MISSING_KEY,
    /** A key is not known at this place. */
    UNKNOWN_KEY,
    /** A key appears twice in one mapping. */
    DUPLICATE_KEY,
    /** A value has the wrong type (a list where a number is expected, ...). */
    WRONG_TYPE,
    /** A number cannot be read, or is NaN or infinite. */
    BAD_NUMBER,
    /** A unit is unknown or of the wrong kind. */
    BAD_UNIT,
    /** A value is outside its allowed range. */
    OUT_OF_RANGE,
    /** Values that are individually fine do not fit together. */
    INCONSISTENT,
    /** A name from a fixed list (model, shape, ...) is not known. */
    UNKNOWN_NAME,
    /** The file is too large, too deep or uses too many aliases. */
    TOO_LARGE,
    /** A command-line argument is wrong. */
    BAD_ARGUMENT,
    /** An output cannot be written. */
    OUTPUT
}
