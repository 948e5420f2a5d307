module a(input x, output y);
  assign y = x;
endmodule
module b(input x, output y);
  assign y = ~x;
endmodule
