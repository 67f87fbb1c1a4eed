// The syntax of OpenQASM 3 (and OpenQASM 2.0) as tledger reads it; the front end parses one top-level statement at a time.
parser grammar QasmParser;

options {
    tokenVocab = QasmLexer;
}

// A whole file (for tools and tests; the front end calls statementOrScope in a loop instead).
program: statementOrScope* EOF;

// One expression and nothing else (values given on the command line).
standaloneExpression: expression EOF;

statementOrScope: statement | scope;
scope: LBRACE statementOrScope* RBRACE;

statement
    : PRAGMA                                                                                    # pragmaStatement
    | ANNOTATION                                                                                # annotationStatement
    | OPENQASM (DecimalIntegerLiteral | FloatLiteral) SEMICOLON                                 # versionStatement
    | INCLUDE (StringLiteral | BitstringLiteral) SEMICOLON                                      # includeStatement
    | DEFCALGRAMMAR (StringLiteral | BitstringLiteral) SEMICOLON                                # defcalgrammarStatement
    | CAL LBRACE opaqueBody RBRACE                                                              # calStatement
    | DEFCAL (~(LBRACE | SEMICOLON))* LBRACE opaqueBody RBRACE                                  # defcalStatement
    | BREAK SEMICOLON                                                                           # breakStatement
    | CONTINUE SEMICOLON                                                                        # continueStatement
    | END SEMICOLON                                                                             # endStatement
    | RETURN (expression | measureExpression)? SEMICOLON                                        # returnStatement
    | FOR (scalarType | QUBIT)? Identifier IN forSet body = statementOrScope                    # forStatement
    | IF LPAREN expression RPAREN thenBody = statementOrScope (ELSE elseBody = statementOrScope)? # ifStatement
    | WHILE LPAREN expression RPAREN body = statementOrScope                                    # whileStatement
    | SWITCH LPAREN expression RPAREN LBRACE opaqueBody RBRACE                                  # switchStatement
    | BARRIER gateOperandList? SEMICOLON                                                        # barrierStatement
    | BOX designator? scope                                                                     # boxStatement
    | DELAY designator gateOperandList? SEMICOLON                                               # delayStatement
    | gateModifier* Identifier (LPAREN expressionList? RPAREN)? designator? gateOperandList SEMICOLON # gateCallStatement
    | gateModifier* GPHASE (LPAREN expressionList? RPAREN)? designator? gateOperandList? SEMICOLON  # gphaseStatement
    | MEASURE gateOperand (ARROW indexedIdentifier)? SEMICOLON                                  # measureArrowStatement
    | RESET gateOperand SEMICOLON                                                               # resetStatement
    | LET Identifier EQUALS aliasExpression SEMICOLON                                           # aliasStatement
    | CONST scalarType Identifier EQUALS declarationExpression SEMICOLON                         # constStatement
    | (INPUT | OUTPUT) (scalarType | arrayType) Identifier SEMICOLON                            # ioStatement
    | (scalarType | arrayType) Identifier (EQUALS declarationExpression)? SEMICOLON             # classicalStatement
    | (CREG | QREG) Identifier designator? SEMICOLON                                            # oldStyleStatement
    | QUBIT designator? Identifier SEMICOLON                                                    # qubitStatement
    | DEF Identifier LPAREN argumentList? RPAREN returnSignature? scope                         # defStatement
    | EXTERN Identifier LPAREN externArgumentList? RPAREN returnSignature? SEMICOLON            # externStatement
    | GATE Identifier (LPAREN identifierList? RPAREN)? identifierList scope                     # gateStatement
    | OPAQUE Identifier (LPAREN identifierList? RPAREN)? identifierList SEMICOLON               # opaqueStatement
    | indexedIdentifier op = (EQUALS | COMPOUND_ASSIGNMENT_OPERATOR) (expression | measureExpression) SEMICOLON # assignmentStatement
    | expression SEMICOLON                                                                      # expressionStatement
    ;

// Bodies the front end does not read (calibrations, switch): any tokens with balanced braces.
opaqueBody: (~(LBRACE | RBRACE) | LBRACE opaqueBody RBRACE)*;

gateModifier: (INV | POW LPAREN expression RPAREN | (CTRL | NEGCTRL) (LPAREN expression RPAREN)?) AT;

gateOperand: indexedIdentifier | HardwareQubit;
gateOperandList: gateOperand (COMMA gateOperand)* COMMA?;
indexedIdentifier: Identifier indexOperator*;
indexOperator: LBRACKET (setExpression | indexItem (COMMA indexItem)* COMMA?) RBRACKET;
indexItem: expression | rangeExpression;
rangeExpression: start = expression? COLON mid = expression? (COLON end = expression)?;
setExpression: LBRACE expression (COMMA expression)* COMMA? RBRACE;
forSet: setExpression | LBRACKET rangeExpression RBRACKET | expression;
aliasExpression: expression (DOUBLE_PLUS expression)*;
declarationExpression: measureExpression | expression | setExpression;
measureExpression: MEASURE gateOperand;
designator: LBRACKET expression RBRACKET;

scalarType
    : BIT designator?
    | INT designator?
    | UINT designator?
    | FLOAT designator?
    | ANGLE designator?
    | BOOL
    | DURATION
    | STRETCH
    | COMPLEX (LBRACKET scalarType RBRACKET)?
    ;
arrayType: ARRAY LBRACKET scalarType COMMA expressionList RBRACKET;
arrayReferenceType: (READONLY | MUTABLE) ARRAY LBRACKET scalarType COMMA (expressionList | DIM EQUALS expression) RBRACKET;

argumentDefinition
    : scalarType Identifier
    | QUBIT designator? Identifier
    | (CREG | QREG) Identifier designator?
    | arrayReferenceType Identifier
    ;
argumentList: argumentDefinition (COMMA argumentDefinition)* COMMA?;
externArgument: scalarType | arrayReferenceType | CREG designator?;
externArgumentList: externArgument (COMMA externArgument)* COMMA?;
returnSignature: ARROW scalarType;
identifierList: Identifier (COMMA Identifier)* COMMA?;
expressionList: expression (COMMA expression)* COMMA?;

expression
    : LPAREN expression RPAREN                                  # parenthesisExpression
    | expression indexOperator                                  # indexExpression
    | <assoc = right> expression DOUBLE_ASTERISK expression     # powerExpression
    | op = (TILDE | EXCLAMATION_POINT | MINUS | PLUS) expression # unaryExpression
    | expression op = (ASTERISK | SLASH | PERCENT) expression   # multiplicativeExpression
    | expression op = (PLUS | MINUS) expression                 # additiveExpression
    | expression op = BITSHIFT_OPERATOR expression              # bitshiftExpression
    | expression op = COMPARISON_OPERATOR expression            # comparisonExpression
    | expression op = EQUALITY_OPERATOR expression              # equalityExpression
    | expression op = AMPERSAND expression                      # bitwiseAndExpression
    | expression op = CARET expression                          # bitwiseXorExpression
    | expression op = PIPE expression                           # bitwiseOrExpression
    | expression op = DOUBLE_AMPERSAND expression               # logicalAndExpression
    | expression op = DOUBLE_PIPE expression                    # logicalOrExpression
    | (scalarType | arrayType) LPAREN expression RPAREN          # castExpression
    | DURATIONOF LPAREN scope RPAREN                            # durationofExpression
    | Identifier LPAREN expressionList? RPAREN                   # callExpression
    | MEASURE gateOperand                                       # measureInExpression
    | (
        Identifier
        | BinaryIntegerLiteral
        | OctalIntegerLiteral
        | DecimalIntegerLiteral
        | HexIntegerLiteral
        | FloatLiteral
        | ImaginaryLiteral
        | BooleanLiteral
        | BitstringLiteral
        | TimingLiteral
        | HardwareQubit
    ) # literalExpression
    ;
