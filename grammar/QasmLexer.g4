// Tokens of OpenQASM 3 (and the OpenQASM 2.0 subset), as tledger reads them.
lexer grammar QasmLexer;

@members {
    /** True when only blanks stand between the start of the line and the character just read (an '@'). */
    private atLineStart(): boolean {
        for (let k = -2; ; k--) {
            const c = this.inputStream.LA(k);
            if (c === -1 || c === 10 || c === 13) return true;
            if (c !== 32 && c !== 9) return false;
        }
    }
}

// Pragmas and annotations carry the rest of their line as text.
PRAGMA: ('#pragma' | 'pragma') ([ \t] ~[\r\n]*)?;
ANNOTATION: '@' { this.atLineStart() }? [a-zA-Z_] [a-zA-Z0-9_.]* ~[\r\n]*;

// Keywords.
OPENQASM: 'OPENQASM';
INCLUDE: 'include';
DEFCALGRAMMAR: 'defcalgrammar';
DEF: 'def';
CAL: 'cal';
DEFCAL: 'defcal';
GATE: 'gate';
OPAQUE: 'opaque';
EXTERN: 'extern';
BOX: 'box';
LET: 'let';
BREAK: 'break';
CONTINUE: 'continue';
IF: 'if';
ELSE: 'else';
END: 'end';
RETURN: 'return';
FOR: 'for';
WHILE: 'while';
IN: 'in';
SWITCH: 'switch';
CASE: 'case';
DEFAULT: 'default';
INPUT: 'input';
OUTPUT: 'output';
CONST: 'const';
READONLY: 'readonly';
MUTABLE: 'mutable';
QREG: 'qreg';
QUBIT: 'qubit';
CREG: 'creg';
BOOL: 'bool';
BIT: 'bit';
INT: 'int';
UINT: 'uint';
FLOAT: 'float';
ANGLE: 'angle';
COMPLEX: 'complex';
ARRAY: 'array';
VOID: 'void';
DURATION: 'duration';
STRETCH: 'stretch';
GPHASE: 'gphase';
INV: 'inv';
POW: 'pow';
CTRL: 'ctrl';
NEGCTRL: 'negctrl';
DIM: '#dim';
DURATIONOF: 'durationof';
DELAY: 'delay';
RESET: 'reset';
MEASURE: 'measure';
BARRIER: 'barrier';
BooleanLiteral: 'true' | 'false';

// Punctuation and operators.
LBRACKET: '[';
RBRACKET: ']';
LBRACE: '{';
RBRACE: '}';
LPAREN: '(';
RPAREN: ')';
COLON: ':';
SEMICOLON: ';';
DOT: '.';
COMMA: ',';
EQUALS: '=';
ARROW: '->';
PLUS: '+';
DOUBLE_PLUS: '++';
MINUS: '-';
ASTERISK: '*';
DOUBLE_ASTERISK: '**';
SLASH: '/';
PERCENT: '%';
PIPE: '|';
DOUBLE_PIPE: '||';
AMPERSAND: '&';
DOUBLE_AMPERSAND: '&&';
CARET: '^';
AT: '@';
TILDE: '~';
EXCLAMATION_POINT: '!';
EQUALITY_OPERATOR: '==' | '!=';
COMPOUND_ASSIGNMENT_OPERATOR: '+=' | '-=' | '*=' | '/=' | '&=' | '|=' | '~=' | '^=' | '<<=' | '>>=' | '%=' | '**=';
COMPARISON_OPERATOR: '>' | '<' | '>=' | '<=';
BITSHIFT_OPERATOR: '>>' | '<<';

// Literals.
ImaginaryLiteral: (DecimalIntegerLiteral | FloatLiteral) [ \t]* 'im';
BinaryIntegerLiteral: ('0b' | '0B') ([01] '_'?)* [01];
OctalIntegerLiteral: '0o' ([0-7] '_'?)* [0-7];
HexIntegerLiteral: ('0x' | '0X') ([0-9a-fA-F] '_'?)* [0-9a-fA-F];
DecimalIntegerLiteral: ([0-9] '_'?)* [0-9];

fragment DigitSeq: ([0-9] '_'?)* [0-9];
fragment Exponent: [eE] [+-]? DigitSeq;
FloatLiteral: DigitSeq Exponent | '.' DigitSeq Exponent? | DigitSeq '.' DigitSeq? Exponent?;

fragment TimeUnit: 'dt' | 'ns' | 'us' | 'µs' | 'ms' | 's';
TimingLiteral: (DecimalIntegerLiteral | FloatLiteral) TimeUnit;

BitstringLiteral: '"' ([01] '_'?)* [01] '"';
StringLiteral: '"' ~["\r\n]* '"' | '\'' ~['\r\n]* '\'';
UnterminatedString: '"' ~["\r\n]* | '\'' ~['\r\n]*;

HardwareQubit: '$' [0-9]+;

fragment FirstIdChar: [_\p{L}];
Identifier: FirstIdChar (FirstIdChar | [0-9])*;

// Layout.
Whitespace: [ \t\r\n\f]+ -> skip;
LineComment: '//' ~[\r\n]* -> skip;
BlockComment: '/*' .*? '*/' -> skip;
UnterminatedComment: '/*' (~'*' | '*'+ ~[*/])* '*'* EOF;

// Anything else becomes one token the parser reports as an unexpected character.
ErrorCharacter: .;
