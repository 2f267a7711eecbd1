"""A relation between columns stated by the user: ``C = A + B``, ``B = prev(B) + A mod 360``.

The right-hand side may use column names, numbers in sexagesimal notation
(``12;5,10``), ``+ - * /``, parentheses, ``prev(X)`` and ``next(X)`` (column X
on the line before or after), and ``round(E, P)`` or ``trunc(E, P)`` (E
rounded to the nearest, halves up, or cut down, to P sexagesimal places, as
a scribe who kept P places did).  A final ``mod N`` reduces the result
modulo N.  A known scheme is stated as ``F = zigzag(d=0;36, M=15;16,5,
m=11;5,5)`` or ``L = step(85:30, 240:36)`` (numcheck.audit.stated).  A relation that uses
``prev`` of its own column is checked as a chain (a slip carried into later
lines is found once); any other is checked row by row.  The expression is
parsed here, never evaluated by Python.
"""

from __future__ import annotations

import re
from fractions import Fraction

from ..errors import NumcheckSyntaxError, UnknownNameError
from .schemes import Scheme

__all__ = ["RelationScheme", "parse_relation"]

_TOKEN = re.compile(r"\s*(?:(?P<num>\d+(?:,\d+)*(?:;\d+(?:,\d+)*)?)|(?P<name>[A-Za-z_][\w']*)"
                    r"|(?P<op>[-+*/()=,]))")


def _number(text: str) -> Fraction:
    whole, _, frac = text.partition(";")
    total = Fraction(0)
    for p in whole.split(","):
        total = total * 60 + int(p)
    if frac:
        for k, p in enumerate(frac.split(","), start=1):
            total += Fraction(int(p), 60 ** k)
    return total


def parse_relation(text: str, columns: list[str]):
    """Parse a relation into (target column, expression tree, modulus or None)."""
    body, modulus = text, None
    m = re.search(r"\bmod\s+(\S+)\s*$", text)
    if m:
        body, modulus = text[:m.start()], _number(m.group(1))
    tokens, pos = [], 0
    while pos < len(body):
        if body[pos:].strip() == "":
            break
        t = _TOKEN.match(body, pos)
        if not t or t.end() == pos:
            raise NumcheckSyntaxError(f"Cannot read the relation {text!r}", text, pos,
                                      expected="column names, numbers, + - * / ( ), prev(X), next(X), round(E, P)")
        kind = t.lastgroup
        tokens.append((kind, t.group(kind), t.start(kind)))
        pos = t.end()
    if len(tokens) < 3 or tokens[0][0] != "name" or tokens[1][1] != "=":
        raise NumcheckSyntaxError(f"A relation names a column, then '=', then an expression: {text!r}",
                                  text, 0, expected="e.g. 'C = A + B'")
    target = tokens[0][1]
    if target not in columns:
        raise UnknownNameError("column", target, columns)
    parser = _Parser(tokens[2:], text, columns)
    tree = parser.expr()
    if parser.i != len(parser.tokens):
        raise NumcheckSyntaxError(f"Unexpected {parser.tokens[parser.i][1]!r} in the relation",
                                  text, parser.tokens[parser.i][2], expected="an operator or the end")
    return target, tree, modulus


class _Parser:
    def __init__(self, tokens, text, columns):
        self.tokens, self.text, self.columns, self.i = tokens, text, columns, 0

    def _peek(self):
        return self.tokens[self.i][1] if self.i < len(self.tokens) else None

    def _take(self):
        tok = self.tokens[self.i] if self.i < len(self.tokens) else None
        if tok is None:
            raise NumcheckSyntaxError("The relation ends too early", self.text, len(self.text),
                                      expected="a column name, a number or '('")
        self.i += 1
        return tok

    def expr(self):
        node = self.term()
        while self._peek() in ("+", "-"):
            op = self._take()[1]
            node = (op, node, self.term())
        return node

    def term(self):
        node = self.factor()
        while self._peek() in ("*", "/"):
            op = self._take()[1]
            node = (op, node, self.factor())
        return node

    def factor(self):
        kind, text, pos = self._take()
        if text == "-":
            return ("neg", self.factor())
        if text == "(":
            node = self.expr()
            if self._take()[1] != ")":
                raise NumcheckSyntaxError("A '(' is not closed in the relation", self.text, pos,
                                          expected="')'")
            return node
        if kind == "num":
            return ("num", _number(text))
        if kind == "name" and text in ("prev", "next") and self._peek() == "(":
            self._take()
            _, name, npos = self._take()
            if name not in self.columns:
                raise UnknownNameError("column", name, self.columns)
            if self._take()[1] != ")":
                raise NumcheckSyntaxError(f"{text}(...) takes one column name", self.text, npos,
                                          expected="')'")
            return (text, name)
        if kind == "name" and text in ("round", "trunc") and self._peek() == "(":
            self._take()
            inner = self.expr()
            sep = self._take()
            if sep[1] != ",":
                raise NumcheckSyntaxError(f"{text}(...) takes an expression, ', ' and a number "
                                          "of places", self.text, sep[2], expected="','")
            pk, places, ppos = self._take()
            if pk != "num" or not places.isdigit() or int(places) > 12:
                raise NumcheckSyntaxError(f"{text}(...) needs a number of places from 0 to 12",
                                          self.text, ppos, expected="e.g. 2")
            if self._take()[1] != ")":
                raise NumcheckSyntaxError(f"A '(' of {text} is not closed", self.text, pos,
                                          expected="')'")
            return (text, inner, int(places))
        if kind == "name":
            if text not in self.columns:
                raise UnknownNameError("column", text, self.columns)
            return ("col", text)
        raise NumcheckSyntaxError(f"Unexpected {text!r} in the relation", self.text, pos,
                                  expected="a column name, a number or '('")


def _names(tree, kind):
    if tree[0] == kind:
        yield tree[1]
    for child in tree[1:]:
        if isinstance(child, tuple):
            yield from _names(child, kind)


class RelationScheme(Scheme):
    """A relation stated by the user, checked exactly."""

    kind = "relation"

    def __init__(self, column, frame, text, tree, modulus):
        super().__init__(column, frame)
        self.text, self.tree = text, tree
        self.rel_modulus = modulus
        self.chained = column in set(_names(tree, "prev"))
        self.inputs = tuple(sorted((set(_names(tree, "col")) | set(_names(tree, "prev"))
                                    | set(_names(tree, "next"))) - {column}))

    def _eval(self, node, i, src, prev_self):
        op = node[0]
        s = self.frame.scale
        if op == "num":
            return node[1]
        if op == "col":
            v = src[node[1]][i] if node[1] != self.column else None
            if v is None:
                raise _Missing
            return Fraction(v, s) if isinstance(v, int) else v / s
        if op == "prev":
            if node[1] == self.column:
                v = prev_self
            else:
                v = src[node[1]][i - 1] if i > 0 else None
            if v is None:
                raise _Missing
            return Fraction(v, s) if isinstance(v, int) else v / s
        if op == "next":
            col = src[node[1]]
            v = col[i + 1] if i + 1 < len(col) else None
            if v is None:
                raise _Missing
            return Fraction(v, s) if isinstance(v, int) else v / s
        if op in ("round", "trunc"):
            x = self._eval(node[1], i, src, prev_self) * 60 ** node[2]
            n = (x + Fraction(1, 2)) // 1 if op == "round" else x // 1
            return Fraction(n, 60 ** node[2])
        if op == "neg":
            return -self._eval(node[1], i, src, prev_self)
        a = self._eval(node[1], i, src, prev_self)
        b = self._eval(node[2], i, src, prev_self)
        if op == "+":
            return a + b
        if op == "-":
            return a - b
        if op == "*":
            return a * b
        if b == 0:
            raise _Missing
        return a / b

    def _value(self, i, src, prev_self):
        try:
            v = self._eval(self.tree, i, src, prev_self)
        except _Missing:
            return None
        if self.rel_modulus:
            v %= self.rel_modulus
        v *= self.frame.scale
        return v.numerator if v.denominator == 1 else v

    def expect(self, i, src):
        return self._value(i, src, None)

    def step(self, state, i, src):
        v = self._value(i, src, state[0])
        return None if v is None else (v, None)

    def back(self, state, i, src):
        return None

    def params(self):
        return {"relation": self.text}

    def describe(self):
        return f"stated relation {self.text}"


class _Missing(Exception):
    """A value the relation needs is damaged or undefined on this line."""
