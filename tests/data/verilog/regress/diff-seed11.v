module top(
  input [3:0] a,
  input signed [3:0] b,
  input [7:0] c,
  input signed [7:0] d,
  input e,
  input signed [1:0] f,
  input [2:0] s,
  input [0:3] g,
  input [5:2] h,
  input signed [12:0] w,
  input signed [0:0] z,
  output [11:0] y0,
  output [18:0] y1,
  output [7:0] y2,
  output signed [14:0] y3,
  output [16:0] y4,
  output signed [13:0] y5,
  output [10:0] y6,
  output signed [10:0] y7,
  output [12:0] y8,
  output signed [6:0] y9,
  output signed [17:0] y10,
  output [2:0] y11,
  output [0:0] y12,
  output signed [15:0] y13,
  output [13:0] y14,
  output [4:0] y15,
  output signed [9:0] y16,
  output [17:0] y17,
  output signed [2:0] y18,
  output signed [6:0] y19,
  output [1:0] y20,
  output [2:0] y21,
  output [16:0] y22,
  output signed [9:0] y23,
  output signed [15:0] y24,
  output signed [4:0] y25,
  output [6:0] y26,
  output [0:0] y27,
  output [17:0] y28,
  output [6:0] y29,
  output [13:0] y30,
  output [4:0] y31,
  output signed [14:0] y32,
  output [13:0] y33,
  output signed [11:0] y34,
  output [11:0] y35,
  output [18:0] y36,
  output [15:0] y37,
  output [17:0] y38,
  output signed [4:0] y39,
  output signed [8:0] y40,
  output [12:0] y41,
  output [12:0] y42,
  output [4:0] y43,
  output signed [9:0] y44,
  output [19:0] y45,
  output [19:0] y46,
  output [5:0] y47,
  output [17:0] y48,
  output [11:0] y49,
  output [0:0] y50,
  output [14:0] y51,
  output [2:0] y52,
  output [10:0] y53,
  output [15:0] y54,
  output [3:0] y55,
  output [16:0] y56,
  output [0:0] y57,
  output signed [13:0] y58,
  output signed [7:0] y59,
  output [5:0] y60,
  output [19:0] y61,
  output signed [13:0] y62,
  output signed [6:0] y63,
  output [16:0] y64,
  output [11:0] y65,
  output signed [13:0] y66,
  output [17:0] y67,
  output [14:0] y68,
  output [0:0] y69,
  output signed [5:0] y70,
  output [0:0] y71,
  output [4:0] y72,
  output signed [11:0] y73,
  output [8:0] y74,
  output signed [9:0] y75,
  output [10:0] y76,
  output [7:0] y77,
  output [10:0] y78,
  output [9:0] y79,
  output [18:0] y80,
  output signed [10:0] y81,
  output [9:0] y82,
  output signed [16:0] y83,
  output signed [12:0] y84,
  output signed [2:0] y85,
  output signed [18:0] y86,
  output [5:0] y87,
  output signed [8:0] y88,
  output [2:0] y89,
  output [17:0] y90,
  output [6:0] y91,
  output signed [4:0] y92,
  output [14:0] y93,
  output [5:0] y94,
  output signed [5:0] y95,
  output [5:0] y96,
  output signed [12:0] y97,
  output [12:0] y98,
  output signed [14:0] y99,
  output signed [14:0] y100,
  output [6:0] y101,
  output [9:0] y102,
  output signed [19:0] y103,
  output signed [16:0] y104,
  output signed [18:0] y105,
  output [6:0] y106,
  output [19:0] y107,
  output signed [1:0] y108,
  output [15:0] y109,
  output [3:0] y110,
  output signed [18:0] y111,
  output signed [7:0] y112,
  output signed [14:0] y113,
  output [14:0] y114,
  output [8:0] y115,
  output signed [4:0] y116,
  output [0:0] y117,
  output signed [6:0] y118,
  output [18:0] y119,
  output [0:0] y120,
  output [9:0] y121,
  output [17:0] y122,
  output signed [6:0] y123,
  output [7:0] y124,
  output [18:0] y125,
  output [9:0] y126,
  output signed [0:0] y127,
  output [11:0] y128,
  output [13:0] y129,
  output signed [6:0] y130,
  output signed [2:0] y131,
  output [10:0] y132,
  output signed [16:0] y133,
  output [9:0] y134,
  output signed [11:0] y135,
  output [11:0] y136,
  output [15:0] y137,
  output [10:0] y138,
  output signed [1:0] y139,
  output signed [12:0] y140,
  output [9:0] y141,
  output [18:0] y142,
  output [19:0] y143,
  output [16:0] y144,
  output [7:0] y145,
  output signed [16:0] y146,
  output [13:0] y147,
  output [8:0] y148,
  output [8:0] y149,
  output signed [7:0] y150,
  output [15:0] y151,
  output signed [17:0] y152,
  output signed [11:0] y153,
  output [15:0] y154,
  output [13:0] y155,
  output [9:0] y156,
  output signed [3:0] y157,
  output signed [3:0] y158,
  output signed [9:0] y159,
  output [13:0] y160,
  output [18:0] y161,
  output signed [9:0] y162,
  output signed [15:0] y163,
  output [15:0] y164,
  output signed [4:0] y165,
  output [3:0] y166,
  output signed [18:0] y167,
  output [10:0] y168,
  output [8:0] y169,
  output [16:0] y170,
  output signed [6:0] y171,
  output signed [1:0] y172,
  output [2:0] y173,
  output [10:0] y174,
  output [11:0] y175,
  output [11:0] y176,
  output signed [18:0] y177,
  output [1:0] y178,
  output [18:0] y179,
  output [14:0] y180,
  output signed [10:0] y181,
  output [7:0] y182,
  output [13:0] y183,
  output [12:0] y184,
  output [11:0] y185,
  output signed [13:0] y186,
  output [6:0] y187,
  output signed [2:0] y188,
  output signed [2:0] y189,
  output [15:0] y190,
  output [14:0] y191,
  output [16:0] y192,
  output signed [9:0] y193,
  output signed [18:0] y194,
  output [9:0] y195,
  output [6:0] y196,
  output signed [15:0] y197,
  output signed [14:0] y198,
  output [18:0] y199,
  output [18:0] y200,
  output [3:0] y201,
  output [2:0] y202,
  output signed [1:0] y203,
  output [18:0] y204,
  output signed [16:0] y205,
  output signed [8:0] y206,
  output [19:0] y207,
  output [3:0] y208,
  output signed [0:0] y209,
  output signed [10:0] y210,
  output signed [5:0] y211,
  output [9:0] y212,
  output [16:0] y213,
  output signed [0:0] y214,
  output [3:0] y215,
  output [13:0] y216,
  output [12:0] y217,
  output signed [0:0] y218,
  output [6:0] y219,
  output signed [11:0] y220,
  output signed [6:0] y221,
  output [7:0] y222,
  output [5:0] y223,
  output [19:0] y224,
  output signed [12:0] y225,
  output signed [12:0] y226,
  output [13:0] y227,
  output [4:0] y228,
  output [8:0] y229,
  output [3:0] y230,
  output signed [19:0] y231,
  output signed [18:0] y232,
  output [8:0] y233,
  output [18:0] y234,
  output signed [18:0] y235,
  output [1:0] y236,
  output signed [2:0] y237,
  output [9:0] y238,
  output signed [5:0] y239,
  output [18:0] y240,
  output signed [15:0] y241,
  output signed [2:0] y242,
  output signed [9:0] y243,
  output [19:0] y244,
  output [7:0] y245,
  output signed [2:0] y246,
  output signed [3:0] y247,
  output [4:0] y248,
  output signed [0:0] y249,
  output [5:0] y250,
  output [14:0] y251,
  output signed [6:0] y252,
  output [12:0] y253,
  output [13:0] y254,
  output [8:0] y255,
  output [1:0] y256,
  output [9:0] y257,
  output [17:0] y258,
  output signed [7:0] y259,
  output [10:0] y260,
  output [10:0] y261,
  output signed [19:0] y262,
  output [16:0] y263,
  output signed [3:0] y264,
  output signed [7:0] y265,
  output signed [3:0] y266,
  output [1:0] y267,
  output [13:0] y268,
  output [16:0] y269,
  output signed [0:0] y270,
  output signed [7:0] y271,
  output [12:0] y272,
  output [12:0] y273,
  output signed [15:0] y274,
  output [14:0] y275,
  output signed [3:0] y276,
  output [14:0] y277,
  output [17:0] y278,
  output signed [6:0] y279,
  output [13:0] y280,
  output [6:0] y281,
  output [19:0] y282,
  output [11:0] y283,
  output [17:0] y284,
  output signed [2:0] y285,
  output signed [9:0] y286,
  output signed [10:0] y287,
  output [10:0] y288,
  output signed [3:0] y289,
  output signed [13:0] y290,
  output [14:0] y291,
  output [17:0] y292,
  output signed [7:0] y293,
  output [3:0] y294,
  output [15:0] y295,
  output [5:0] y296,
  output [17:0] y297,
  output [0:0] y298,
  output [16:0] y299,
  output [6:0] y300,
  output [9:0] y301,
  output [5:0] y302,
  output signed [16:0] y303,
  output [6:0] y304,
  output [2:0] y305,
  output [3:0] y306,
  output signed [13:0] y307,
  output [13:0] y308,
  output [14:0] y309,
  output [1:0] y310,
  output [5:0] y311,
  output signed [8:0] y312,
  output [14:0] y313,
  output [10:0] y314,
  output signed [7:0] y315,
  output signed [15:0] y316,
  output [10:0] y317,
  output [2:0] y318,
  output signed [17:0] y319,
  output signed [5:0] y320,
  output signed [12:0] y321,
  output signed [18:0] y322,
  output signed [0:0] y323,
  output [0:0] y324,
  output signed [13:0] y325,
  output [16:0] y326,
  output signed [3:0] y327,
  output signed [9:0] y328,
  output signed [11:0] y329,
  output signed [19:0] y330,
  output signed [17:0] y331,
  output [0:0] y332,
  output signed [12:0] y333,
  output [16:0] y334,
  output signed [15:0] y335,
  output [9:0] y336,
  output [2:0] y337,
  output [10:0] y338,
  output [19:0] y339,
  output signed [7:0] y340,
  output [5:0] y341,
  output [7:0] y342,
  output [8:0] y343,
  output [9:0] y344,
  output signed [9:0] y345,
  output signed [7:0] y346,
  output [8:0] y347,
  output signed [1:0] y348,
  output [15:0] y349,
  output signed [15:0] y350,
  output [16:0] y351,
  output [7:0] y352,
  output [12:0] y353,
  output [3:0] y354,
  output signed [14:0] y355,
  output signed [6:0] y356,
  output signed [18:0] y357,
  output [7:0] y358,
  output [1:0] y359,
  output [6:0] y360,
  output [9:0] y361,
  output signed [8:0] y362,
  output [17:0] y363,
  output [16:0] y364,
  output [10:0] y365,
  output [7:0] y366,
  output signed [3:0] y367,
  output [17:0] y368,
  output signed [12:0] y369,
  output signed [15:0] y370,
  output [4:0] y371,
  output signed [10:0] y372,
  output signed [5:0] y373,
  output [15:0] y374,
  output [11:0] y375,
  output [13:0] y376,
  output signed [14:0] y377,
  output [9:0] y378,
  output [7:0] y379,
  output signed [6:0] y380,
  output [2:0] y381,
  output signed [2:0] y382,
  output [4:0] y383,
  output signed [3:0] y384,
  output signed [1:0] y385,
  output [19:0] y386,
  output [8:0] y387,
  output [17:0] y388,
  output signed [15:0] y389,
  output signed [6:0] y390,
  output [10:0] y391,
  output [1:0] y392,
  output [9:0] y393,
  output [16:0] y394,
  output signed [6:0] y395,
  output signed [6:0] y396,
  output signed [3:0] y397,
  output [10:0] y398,
  output [1:0] y399,
  output signed [4:0] y400,
  output signed [13:0] y401,
  output [0:0] y402,
  output signed [0:0] y403,
  output [12:0] y404,
  output [15:0] y405,
  output signed [1:0] y406,
  output [11:0] y407,
  output [15:0] y408,
  output [6:0] y409,
  output [1:0] y410,
  output signed [11:0] y411,
  output [5:0] y412,
  output signed [16:0] y413,
  output [8:0] y414,
  output [8:0] y415,
  output [14:0] y416,
  output signed [11:0] y417,
  output signed [13:0] y418,
  output signed [17:0] y419,
  output [8:0] y420,
  output signed [0:0] y421,
  output [5:0] y422,
  output [3:0] y423,
  output signed [12:0] y424,
  output signed [13:0] y425,
  output signed [12:0] y426,
  output signed [2:0] y427,
  output signed [13:0] y428,
  output signed [12:0] y429,
  output [8:0] y430,
  output [14:0] y431,
  output [16:0] y432,
  output signed [12:0] y433,
  output [10:0] y434,
  output [12:0] y435,
  output [1:0] y436,
  output signed [10:0] y437,
  output signed [6:0] y438,
  output signed [12:0] y439,
  output [16:0] y440,
  output signed [6:0] y441,
  output [19:0] y442,
  output [0:0] y443,
  output [12:0] y444,
  output [16:0] y445,
  output signed [6:0] y446,
  output [8:0] y447,
  output signed [6:0] y448,
  output [8:0] y449,
  output [1:0] y450,
  output [5:0] y451,
  output [18:0] y452,
  output signed [8:0] y453,
  output signed [19:0] y454,
  output [17:0] y455,
  output [12:0] y456,
  output signed [12:0] y457,
  output signed [2:0] y458,
  output [1:0] y459,
  output [15:0] y460,
  output signed [14:0] y461,
  output [3:0] y462,
  output [18:0] y463,
  output signed [7:0] y464,
  output [4:0] y465,
  output [18:0] y466,
  output [7:0] y467,
  output [12:0] y468,
  output [14:0] y469,
  output [11:0] y470,
  output signed [14:0] y471,
  output [9:0] y472,
  output [9:0] y473,
  output [9:0] y474,
  output [6:0] y475,
  output signed [12:0] y476,
  output [5:0] y477,
  output [11:0] y478,
  output [12:0] y479,
  output [0:0] y480,
  output [1:0] y481,
  output signed [13:0] y482,
  output [18:0] y483,
  output [0:0] y484,
  output [16:0] y485,
  output [16:0] y486,
  output signed [18:0] y487,
  output signed [8:0] y488,
  output [13:0] y489,
  output signed [10:0] y490,
  output signed [8:0] y491,
  output signed [13:0] y492,
  output [12:0] y493,
  output [12:0] y494,
  output [16:0] y495,
  output signed [5:0] y496,
  output signed [19:0] y497,
  output [15:0] y498,
  output signed [14:0] y499
);
  assign y0 = ((e <= 7'h1f) ^ (b || 6'h32));
  assign y1 = {($signed((~^(g[1]))) + ((d[f] != e) & {3{e}})), (~&((3'sh3 || a[s])))};
  assign y2 = (((s[2] + b) != (w ~^ 9'sh10c)) ^~ $unsigned((c[f] <<< 3)));
  assign y3 = {2{(~(e))}};
  assign y4 = f;
  assign y5 = ((({h} <<< f) ? ((d[f] ^ g) ^ (~(w))) : b) <<< 5);
  assign y6 = (((w ? d : a[0+:4]) & $signed(f)) & {$unsigned(a[e])});
  assign y7 = (((h[3] || e) ~^ {1{b[0]}}) - (~&((b[3] || a))));
  assign y8 = (c[1] & s[0]);
  assign y9 = ({h[2:2]} >>> 4);
  assign y10 = ((((1'b1 ? s[2-:2] : a) & $unsigned(d[s+:7])) * (~^((e * h[4-:2])))) >>> s);
  assign y11 = ({e} ^ (~&(g[0])));
  assign y12 = {2{$signed(d[s-:4])}};
  assign y13 = 6'o52;
  assign y14 = (&(3));
  assign y15 = $unsigned((d > s));
  assign y16 = ($unsigned({2{(7'h3f + g[3])}}) != (~|(w)));
  assign y17 = {2{(&(d))}};
  assign y18 = (w >> s);
  assign y19 = ({2{({a[3:3], 8'o314} ~^ $signed(1'd1))}} + ((31 ? {w} : (~&(4'd15))) + ((c ? 22 : h[4:2]) * (d + c[7:3]))));
  assign y20 = (~|($signed((f & b[3]))));
  assign y21 = ((({w[11:2]} >= (w ^~ c[4:0])) <= ({1{8'd90}} ? {s[0], h[2]} : {1'b1})) & z);
  assign y22 = ((e & a[f]) <= $signed(f));
  assign y23 = ((-(($unsigned(s[s+:3]) + (s[f] || a)))) * f);
  assign y24 = ((z || z) + (6'b10101 ^ w[e]));
  assign y25 = 4'b100;
  assign y26 = (~^((h[e] <= 5'sd15)));
  assign y27 = ((w[12] ^ f) ? (15 <= 1'sh1) : {2'sh3});
  assign y28 = ((a[3:0] >= e) ? $signed(4'd4) : (w[s] - f));
  assign y29 = (c[f] << s);
  assign y30 = ($unsigned(e) ^ ('h97 == b[3:1]));
  assign y31 = (b ^ a[0]);
  assign y32 = (7'sh9 ? (~&(s)) : (g[1] ~^ f));
  assign y33 = (+(h));
  assign y34 = ({((z[e] ^~ 6'sd20) ? d : (s * d)), {(3'd6 >>> f), $signed(d)}} ^ z[s-:1]);
  assign y35 = ((+(($unsigned(w[12-:13]) >= (7'd114 ? w : b)))) & (f > ((&(z)) | w[s+:4])));
  assign y36 = (~&(f[a]));
  assign y37 = (h == 9'o525);
  assign y38 = {2{($unsigned(g) > (f | w))}};
  assign y39 = (((h[s] ? g : h[3-:2]) - (w - f[a])) || (z ^ (~(d))));
  assign y40 = {3{(f[1:1] + z)}};
  assign y41 = $unsigned((~^((z[0] & s))));
  assign y42 = (z ? (e + z) : (f * f));
  assign y43 = $unsigned((({c} >> 2) ^~ b));
  assign y44 = (e > g);
  assign y45 = ({1{s}} < (b ^ w));
  assign y46 = $unsigned(z);
  assign y47 = (z[0] - e);
  assign y48 = (((w[9:1] || (&(d[7:3]))) << f) >>> f);
  assign y49 = (f[a] + c);
  assign y50 = ({2{f}} <= (h + c));
  assign y51 = (((9'd196 ? e : g) ? (^(z)) : (g[s-:2] & c)) & (&((h[4:2] & a[0]))));
  assign y52 = {((~^(6'h1d)) + a[s])};
  assign y53 = (((!((8'sd119 ? h : z))) & $unsigned({9'd250})) - (((!(4)) >>> s) - a[f]));
  assign y54 = (c[f] ? 2'o0 : d);
  assign y55 = (+((f[0] <= w[9:0])));
  assign y56 = (w == 5'sd22);
  assign y57 = {1{(((~|(a)) * (s ? 6'd31 : a[2])) & ((b[3] + 8'o211) ? (b ? a : 4'sd6) : (|(b))))}};
  assign y58 = 9'hd1;
  assign y59 = 4'd3;
  assign y60 = (f ~^ d[s]);
  assign y61 = (((-(e)) & (w & f[1])) <= ((2'sd2 > 5'sh13) ? (27 || z[0-:1]) : d));
  assign y62 = (z ^ z);
  assign y63 = (($signed((&(s[f]))) - 11) && ($unsigned((g & 8'so270)) >= (d[s-:7] + h)));
  assign y64 = (+(c[7:4]));
  assign y65 = (~^((((f[0:0] + s) >>> 0) - {2{(4'sd14 > 4'b1100)}})));
  assign y66 = 9'sb1101010;
  assign y67 = (((s >> 5) ^~ (~|(d))) ^~ (~&((f ~^ s))));
  assign y68 = z;
  assign y69 = (g <= b[1-:1]);
  assign y70 = g[1:3];
  assign y71 = ((&((a ~^ f[0]))) >> 5);
  assign y72 = (w[8:5] ? d : b);
  assign y73 = $signed(s);
  assign y74 = (~(z));
  assign y75 = (&((&('h11e))));
  assign y76 = (7'o130 << f);
  assign y77 = {(h[3] ^ ($unsigned(s) ? (d >= 3'sd2) : (9'o125 ? c[4] : e))), (^((-({1'd1, h[a]})))), $signed((h[4:2] <<< 3'd3))};
  assign y78 = ($unsigned(b[1]) <<< 5);
  assign y79 = (+(b));
  assign y80 = (1'sd0 ? (b[0] ? 18 : c) : (b ? d[0] : d));
  assign y81 = (z < a[1]);
  assign y82 = ((d <<< f) - a);
  assign y83 = {1{(s && 8'b11010)}};
  assign y84 = 5'd2;
  assign y85 = $unsigned((((!(c[0])) >> 0) & (^((g[1:3] >= g)))));
  assign y86 = $unsigned((g ? z : (z && g[e])));
  assign y87 = w;
  assign y88 = (&((z == 5'so26)));
  assign y89 = (c > f);
  assign y90 = ((('hf9 & h[4:4]) >>> f) - (~|((f ? g : 7'sd103))));
  assign y91 = ((((g[0:3] ~^ e) ^ (d & c)) ? ((z ^ d[e]) >= {z[0+:1], 7'o36}) : $signed((a[3] == 14))) ? $signed(g[3]) : s);
  assign y92 = (w & (1'b1 <<< f));
  assign y93 = (e * a[f]);
  assign y94 = (~&(((3'd5 >= c[1]) < z)));
  assign y95 = b;
  assign y96 = (f < f);
  assign y97 = (w[9] - (d[7:1] > h[e]));
  assign y98 = (+((^(g))));
  assign y99 = {s, c[0], ({(w[a] && w), b[3:0]} ^ ((s[e] ^ c[7:5]) & (w[s] * e)))};
  assign y100 = (((g || h[4]) >= (b <= e)) ? b : ((z << 0) | a));
  assign y101 = (($unsigned(a) <<< f) ? ({h, g} <<< 4) : ((e > h[2:2]) + (d >>> s)));
  assign y102 = ((('h72 + b[3:2]) ? (26 & 2'so2) : (|(9'sb110001011))) < ((5'd15 ? d : b) == $signed(b[f])));
  assign y103 = a;
  assign y104 = {w, w[9:6]};
  assign y105 = (~|(e));
  assign y106 = (a != z);
  assign y107 = ((e >> 4) | e);
  assign y108 = (~&({(2'h0 | (f - 7'h54))}));
  assign y109 = (h ? d[1] : 9'o432);
  assign y110 = (d[7:0] ^ s);
  assign y111 = (b[s+:1] & s);
  assign y112 = b;
  assign y113 = g[f];
  assign y114 = (h > b[0+:2]);
  assign y115 = (({3{a}} ? (b || d[s]) : g[e]) ^ ((~|(7'o116)) >= (g >>> f)));
  assign y116 = (2'b10 ^ b[2:2]);
  assign y117 = (((+({g[1:2], d[4]})) <= ((-(f[1:0])) ^ (e + g))) | 1'h0);
  assign y118 = {(e == 9'd471), ((g * (^(e))) >>> s)};
  assign y119 = a[3];
  assign y120 = {2{$signed(((h ? h[3:2] : c[1]) != (2'h3 + e)))}};
  assign y121 = (23 + f);
  assign y122 = (e && s);
  assign y123 = ((a[1] >> s) & (~^((f[1] * d))));
  assign y124 = 9'd193;
  assign y125 = ((f & d[a]) * (-((h << 0))));
  assign y126 = $signed(f[1-:2]);
  assign y127 = $signed(s[0]);
  assign y128 = (((b + s) >= (f >= z)) ~^ ($signed(8'h69) ^ 2'b1));
  assign y129 = $signed(({h[5:4], e} != f[1]));
  assign y130 = $unsigned((~((z ? (|(c)) : (s < c[f])))));
  assign y131 = ((((~&(s)) || {c}) >= z[0]) | $unsigned((9'd160 - a)));
  assign y132 = (w[5:1] + e);
  assign y133 = d;
  assign y134 = $signed($unsigned(b[s+:1]));
  assign y135 = {3{2'd1}};
  assign y136 = ((39 ? 1'b1 : w[10:7]) - (s ^~ s));
  assign y137 = (z[e] & 9'so316);
  assign y138 = s[2:2];
  assign y139 = z[0:0];
  assign y140 = ($signed(b) >>> f);
  assign y141 = {{((z - z[s-:1]) != (e <= 9'o354)), 7'h2c}, c, (({9'sd229} - $unsigned(5'o37)) ? {1{(c[f] - c[3])}} : (^((h[a] > h))))};
  assign y142 = (+((8'b1000011 + e)));
  assign y143 = $signed((e ? h[4] : c));
  assign y144 = (s < 4);
  assign y145 = {h, 8'o30, e};
  assign y146 = f[a];
  assign y147 = $signed((b ~^ ((s * f[1]) != (g[3] < h))));
  assign y148 = (c | g[s-:4]);
  assign y149 = g;
  assign y150 = (s ~^ e);
  assign y151 = ((((5'b11010 >>> 1) != (f ^ 5'so26)) - h) ? d : {1{g}});
  assign y152 = (((|({2{7'shb}})) == {1{(a[1:0] << s)}}) <<< s);
  assign y153 = (&(g[s-:1]));
  assign y154 = {w, d[7:5], 9'd511};
  assign y155 = (s[2] ^ b[1:0]);
  assign y156 = ((w >> f) ^ (((z << s) ? (&(e)) : (h ^~ d)) + g));
  assign y157 = ((5'h1d ^~ 9'b11110010) - (19 & b));
  assign y158 = (~&(b));
  assign y159 = ((($unsigned(9'o451) || (9'sha6 + c[s+:6])) != {(6'h3b << s), (z[0+:1] >>> f)}) + g);
  assign y160 = (7'h26 < h[2]);
  assign y161 = {(w[e] > e)};
  assign y162 = (w[6] & z[0]);
  assign y163 = 5;
  assign y164 = ((a[0] & {2{w[s+:2]}}) ? ((f | w) ^ (f[s-:2] || z)) : a);
  assign y165 = ((((w[10:6] >>> s) | (s ^ b[s])) < $unsigned((h[2] >> 3))) & (^($signed($signed(w)))));
  assign y166 = (|(c));
  assign y167 = (e | 'hf4);
  assign y168 = (+((((~|(2'o0)) != (h - f[1:1])) <= ({3{w[e]}} | (s + g[0:3])))));
  assign y169 = (((37 ? f : 4'd15) ^~ (c - s)) ^ f[0]);
  assign y170 = 2'sh1;
  assign y171 = (a ^ $unsigned((g != s)));
  assign y172 = (((+(e)) + (s < a)) == ((a + a) & (3'sb11 ? c[a] : w[f])));
  assign y173 = a;
  assign y174 = 1'b1;
  assign y175 = 7'h23;
  assign y176 = 5'so1;
  assign y177 = (~&(b[3]));
  assign y178 = d;
  assign y179 = (g & (-(((8'o300 & e) ~^ $unsigned(25)))));
  assign y180 = ((a - e) >>> s);
  assign y181 = (d[7:6] > 9'b110110010);
  assign y182 = 6'h11;
  assign y183 = w;
  assign y184 = ((3'd4 ? 8'b110100 : f[f]) ^ (5'so15 ? z : s));
  assign y185 = $signed(a);
  assign y186 = (({g, (g | f)} <<< s) != {3'd6});
  assign y187 = s[2];
  assign y188 = (((w[6] ^ h) && (b[3:2] >= 9'sd481)) * (w >>> s));
  assign y189 = ((((f ^ z[0:0]) | (~|(h[2]))) >> 1) >> 3);
  assign y190 = (30 + (4'so10 ^ c));
  assign y191 = ((z ? (^((e ? 3'o5 : f[s+:1]))) : f) ^ $unsigned(((h * a) != z[f])));
  assign y192 = (c ? f[a] : 6'h3f);
  assign y193 = e;
  assign y194 = s;
  assign y195 = ($signed((~|(s))) && {(h - z), (z[0:0] && s[2:1])});
  assign y196 = e;
  assign y197 = (h && e);
  assign y198 = $signed(b);
  assign y199 = ((c[1:1] - e) ^~ 6'o30);
  assign y200 = ($signed((f ^ d[1:0])) ^ $unsigned(a));
  assign y201 = (-(z[0-:1]));
  assign y202 = ((a * e) == a);
  assign y203 = s;
  assign y204 = $unsigned((g[f] <<< 5));
  assign y205 = (|($signed({w})));
  assign y206 = (~^((((e ^ s[0:0]) != e) ? ((^(g[1])) + (b[3:0] >> s)) : ((a - a) ^~ (9'd476 <= z)))));
  assign y207 = (a[2:0] && (-(21)));
  assign y208 = (&({(h[5] ? z : g), (3'o2 >> s)}));
  assign y209 = (((|(f)) == (z[0:0] - d[e])) > ((!(w)) | a[s-:2]));
  assign y210 = (+((e * s[1:0])));
  assign y211 = ($unsigned(((f[1:0] <= g[0:2]) ^ (~|(h)))) ? (((a <<< f) ^~ (b ? g[1:3] : f[1])) >= 9'h1e0) : {1{{(7'o102 && d[f]), (b[s+:2] ? 6'd26 : c)}}});
  assign y212 = ((w >> f) ? w : $signed(w));
  assign y213 = (~({2{(g & e)}}));
  assign y214 = e;
  assign y215 = ({(e || (c - 4'b110))} - 1'so1);
  assign y216 = 8'd160;
  assign y217 = ((((f[s-:1] >> s) && ('he3 * e)) && s) ? (+(((f[0:0] || w) >= a[s]))) : (|(z[0])));
  assign y218 = a;
  assign y219 = (-(14));
  assign y220 = h[e];
  assign y221 = b[2];
  assign y222 = {g, d};
  assign y223 = (~^({(~(f[s]))}));
  assign y224 = (1'b0 < 15);
  assign y225 = ({1{e}} != {3'd3, 1'h1});
  assign y226 = {(h ^~ h), (g > c), (g[2:3] ^~ h)};
  assign y227 = (c[5:2] - a[e]);
  assign y228 = ($unsigned(w) << 0);
  assign y229 = (((c[a] + c) & w[10:7]) <= ({3'sd1, a[0]} & 1'so1));
  assign y230 = $signed(a);
  assign y231 = {2{e}};
  assign y232 = {1{(((g[1:2] ? 8'h50 : 2'o1) < $signed(d[7:3])) ^ ((!(d[2:2])) ^ g))}};
  assign y233 = b[e];
  assign y234 = (33 >>> s);
  assign y235 = (|((b[e] || f[s+:1])));
  assign y236 = (!((({6'b101} ~^ $unsigned(h)) >>> 5)));
  assign y237 = ('h38 == c);
  assign y238 = $signed((f[1:1] ? e : c[s+:7]));
  assign y239 = ((2'd0 < w) ~^ (^(a)));
  assign y240 = (f && s);
  assign y241 = z[0:0];
  assign y242 = $signed(f[0]);
  assign y243 = (({2{c}} + $unsigned(f[0:0])) + (~|($unsigned(g))));
  assign y244 = (h[3] << s);
  assign y245 = f;
  assign y246 = ((({d} != 2'b10) - ((b - g) - (a < a))) * ($unsigned((-(4'h5))) && (+((s & h)))));
  assign y247 = (f << 3);
  assign y248 = 8'h13;
  assign y249 = (|(3'sd7));
  assign y250 = ({1{z[0:0]}} != {8'so230, g[0]});
  assign y251 = (h[5:2] | a);
  assign y252 = ({(b[1] - h[5:4]), (~|(w[1]))} ? ((~|(d[s-:1])) | (z ^ a[3])) : $unsigned((s <<< s)));
  assign y253 = ('h29 + (h >>> s));
  assign y254 = (a != e);
  assign y255 = f;
  assign y256 = w[8];
  assign y257 = ($unsigned({d, {f, f}}) && (((e ~^ c) <<< 0) ? e : ((w + c) >>> s)));
  assign y258 = 'ha6;
  assign y259 = (^((-((!((f[1-:2] && 5'o27)))))));
  assign y260 = b[s-:4];
  assign y261 = 11;
  assign y262 = e;
  assign y263 = (((-(a[e])) | $unsigned(s)) + (-((b ^~ 'h7f))));
  assign y264 = (~^(f[0]));
  assign y265 = g;
  assign y266 = $signed(z[s+:1]);
  assign y267 = 4'b1111;
  assign y268 = $signed(((~^(c)) ? z[f] : {s[2:1], w}));
  assign y269 = (~^((~((e && h[2])))));
  assign y270 = ((f != d[f]) ~^ (z >>> f));
  assign y271 = e;
  assign y272 = e;
  assign y273 = (('h54 - f[s-:1]) + (15 == h[3]));
  assign y274 = (((c[7:5] & (e ^ h[s])) ? ((s[1+:1] ~^ c) != (s ? a : 1'd0)) : ((w[s] == w) * s[0])) >= $unsigned(((e - w[f]) != e)));
  assign y275 = (+(c));
  assign y276 = (~|((s <<< f)));
  assign y277 = 3'h0;
  assign y278 = ((~&({3{w}})) - (|((d[7:1] & d))));
  assign y279 = (s[2] || d[6:4]);
  assign y280 = b;
  assign y281 = $signed((^($signed(e))));
  assign y282 = g;
  assign y283 = ((e && e) > {2{4'o0}});
  assign y284 = 7'o103;
  assign y285 = e;
  assign y286 = (e - 7);
  assign y287 = ((~&(7'sh61)) ? g[f] : {6'sb110101, h[f]});
  assign y288 = f;
  assign y289 = ((f ? f : b[0]) ^ (a[0] <= b[a]));
  assign y290 = 27;
  assign y291 = ({((+(e)) == (s ? 3'd2 : f)), f[s]} >>> f);
  assign y292 = (38 & a[1]);
  assign y293 = 6'o61;
  assign y294 = (0 ? z[0:0] : f);
  assign y295 = 5'b10011;
  assign y296 = {3'd4, b[2:1]};
  assign y297 = b[e];
  assign y298 = $unsigned((6'd17 ? s[0:0] : e));
  assign y299 = (e & w[11]);
  assign y300 = (g[3-:2] >>> s);
  assign y301 = w[a];
  assign y302 = ((^((32 >= f))) * ((w + a[0:0]) ? (c > c[6:3]) : (s ^ b)));
  assign y303 = ($signed(w) + (4'h6 >= h));
  assign y304 = (((3'd3 | f) ? (z ^~ 2'sh2) : {1'b0}) > (a[2:1] * (f || h[s+:3])));
  assign y305 = ($unsigned((d | g)) ^~ ((a[0] < 1'b1) & (c[3] ~^ f[s-:2])));
  assign y306 = {(~|(({2{f}} ? (z[0:0] ? w : 8'so320) : $unsigned(f[0:0])))), ($unsigned((a[f] > z[e])) >> f), $unsigned($signed(h))};
  assign y307 = ((d[3:2] | {2{(c[s] >= d)}}) >> f);
  assign y308 = (8'o151 ? (~&($unsigned((d[7+:1] >>> s)))) : z[0]);
  assign y309 = (($signed({b, 1'b0, h}) <= 4'h1) ^~ {1{b}});
  assign y310 = (((s ~^ a) >> 4) >> s);
  assign y311 = b;
  assign y312 = ((z >= (w * s[e])) - ((9'h1c ? a : w[7:2]) << 2));
  assign y313 = $unsigned((~^(d)));
  assign y314 = ('h45 && a[2:1]);
  assign y315 = $signed(({w[6-:1], g[1]} & (a ? d : w)));
  assign y316 = ((b ? d[3:3] : s[2:0]) + (((h - g) != d[3]) * (!(s[s]))));
  assign y317 = d[e];
  assign y318 = ((~^((7'so152 * e))) - ($signed(z[0:0]) || (a[1] ^~ a)));
  assign y319 = ($signed(e) - {h[a]});
  assign y320 = f;
  assign y321 = (c[e] <<< f);
  assign y322 = ((h - b[1+:3]) * (h[4:4] > s[1]));
  assign y323 = ((({h, z, 3'sh5} * w) < {c, s, (z > 3'h5)}) + (({h, b} << 3) - {1{z[0:0]}}));
  assign y324 = z;
  assign y325 = ((((f[f] ~^ c) | {c, d}) & ((9'sd456 - w[s]) * (c & 8'b10010000))) || c);
  assign y326 = (c[f] ? {a[0], 8'b10010100, 6'shd} : (!(b[0])));
  assign y327 = (a[s-:3] | (((e <= z) < (z[0:0] == d)) ^ ((z & s[1]) ^ c[6:1])));
  assign y328 = $signed(({(w ^ b), $signed(a)} & $signed((h[5:3] <<< f))));
  assign y329 = ((((~^(g)) - f) ? ((s <<< 1) >> f) : (8'so220 * (28 >> f))) << 1);
  assign y330 = ((s[2] - f) ~^ 5);
  assign y331 = e;
  assign y332 = (($unsigned(z) >>> 1) == ((^((f || f))) ^~ ({f[1:1]} ^~ (b[f] ? w : a))));
  assign y333 = {((e ? (e * z) : (-(w))) == ((&(9'sb100110011)) << f)), {((a <= c) == f[0]), ((5'o30 ^ 5'h11) * $signed(d[e]))}};
  assign y334 = (h - e);
  assign y335 = (h ? {d, $unsigned((s & z[f]))} : {(!(h)), (~^((a - 3'sd3)))});
  assign y336 = z[0:0];
  assign y337 = h[e];
  assign y338 = ((w[12:7] ~^ b[s-:4]) & {2{b[3-:1]}});
  assign y339 = h[4:2];
  assign y340 = (((s[2] != (33 & w)) ? 26 : ({2{d[a]}} <= (1'd0 << 4))) ^ $unsigned(((d[1:1] ^ a[0]) ? {4'b0} : (|(3)))));
  assign y341 = {8'sb11101111};
  assign y342 = $unsigned(((^(f[0:0])) < (-(s[a]))));
  assign y343 = (~((4'o2 >= z)));
  assign y344 = ((~&((d[s] - f))) << s);
  assign y345 = ($unsigned((w[9:2] > 6'h25)) ? ($unsigned(z) | (8'sb11000 & g)) : ((d == 13) & (w ? e : 7'b1010)));
  assign y346 = {((h[f] - s) || {1{s}})};
  assign y347 = $signed((w | (w[4] && f)));
  assign y348 = {7'sd44};
  assign y349 = (z || g[0:3]);
  assign y350 = (31 || 1'o0);
  assign y351 = ((~^($unsigned(3))) ? 2'h3 : 5'd16);
  assign y352 = g;
  assign y353 = (!((~^(({1{c[a]}} ~^ (-(5'd21)))))));
  assign y354 = ($signed(((~^(s[1])) ^ (f[e] << 2))) || (|((h ^~ $unsigned(a)))));
  assign y355 = ((({1{z[s]}} + e) >= $unsigned((!(d)))) + $signed((d >= g)));
  assign y356 = {(c[1+:3] <= h), $signed(g)};
  assign y357 = ((|(((3'o6 && 3'o3) != {s[2:2]}))) != (($signed(z) & (|(b[s]))) ? $signed((!(f))) : (~|(z))));
  assign y358 = ((z ^ e) <<< 5);
  assign y359 = a;
  assign y360 = ({2{(+((h ? b : d)))}} == w);
  assign y361 = {(c >>> f), z[0:0]};
  assign y362 = (&((w[s+:6] + 8'o22)));
  assign y363 = (^(w));
  assign y364 = ((s[2:1] - z) || $signed(b));
  assign y365 = (2'd1 && s);
  assign y366 = (|(1'd1));
  assign y367 = z[0:0];
  assign y368 = (!((h != e)));
  assign y369 = 1'd1;
  assign y370 = e;
  assign y371 = 1'o0;
  assign y372 = (z[0:0] - e);
  assign y373 = f;
  assign y374 = (z >> f);
  assign y375 = ('hc2 == e);
  assign y376 = ((g == $signed(b[3:2])) && (g[s+:4] ^ (~|(f))));
  assign y377 = (c[1] >> s);
  assign y378 = (($signed(b) + (h | 4'b1)) & {1{$unsigned(1'o0)}});
  assign y379 = ((e == (25 ? 4'h4 : 4'sd7)) ? (a[s] != c) : d[0]);
  assign y380 = {a, a[s]};
  assign y381 = ($unsigned(a) != (d[s] >> 2));
  assign y382 = (c < 16);
  assign y383 = (~|(e));
  assign y384 = s;
  assign y385 = (e ^~ $signed(((e || w) & (w ^~ 9'h27))));
  assign y386 = f[0];
  assign y387 = (d[s] >> s);
  assign y388 = ((({3{1'so1}} ^ g) ^ ((a != a[2:0]) <= (e - a))) <= g[f]);
  assign y389 = (c || e);
  assign y390 = (c | (((a >> s) < b) || {(e == w[s]), g}));
  assign y391 = (9'b100011000 < (z[0:0] ? s : c[1]));
  assign y392 = 'h83;
  assign y393 = (|(b[1]));
  assign y394 = (|(((h * z[0+:1]) & (h[4:2] - s[2]))));
  assign y395 = (f[0] || (+((h >>> 5))));
  assign y396 = (c == d);
  assign y397 = $unsigned(((~^(z[a])) ~^ (s * b)));
  assign y398 = ((g ~^ b) ? (w <<< 0) : 3'so1);
  assign y399 = (((e ? s : e) ^~ (c || a)) && (1'h1 & (w < 6'so57)));
  assign y400 = f;
  assign y401 = {1{$signed(({1'b0, h, a} - (~|(z[e]))))}};
  assign y402 = ({5'd22, (~|((~^(s)))), ((c[5:2] * s[2:2]) <= (c != 7'sb100))} ^~ w);
  assign y403 = (((e << s) <<< 2) ? ((g <<< 1) - ((2'o3 ? w[a] : w) << 0)) : ({{5'd12, g}, (z * g[0])} >>> s));
  assign y404 = ($signed(d) ^ (g <<< f));
  assign y405 = (((b + a[1]) ^ (z[0:0] ~^ e)) || ((z ^~ a[1]) ? c : (27 ~^ 7'sd102)));
  assign y406 = ((c ? ((a[2:1] << f) >= {a[0], d[a]}) : ((s <<< s) >= 9'd217)) >> f);
  assign y407 = {((~((z >> s))) & (|((w[9:3] >> s))))};
  assign y408 = ((w & (f[1:0] & (2'sb10 & 3'h2))) || ({3{(a >> f)}} <= ({2'sb10, s, e} && (e >>> 3))));
  assign y409 = g;
  assign y410 = 'hd7;
  assign y411 = 8'b11101100;
  assign y412 = ({1{(g[s+:2] >> s)}} ? ($unsigned(w) <= h) : ($unsigned(38) ? z[0] : (-(w[10:7]))));
  assign y413 = (e != 14);
  assign y414 = (d[s-:6] >= f);
  assign y415 = (((^(9'o443)) ^~ b[1+:2]) == f);
  assign y416 = (b >> f);
  assign y417 = (6'd32 - h);
  assign y418 = (({{w}, c[7:3], (|(a))} >>> s) ~^ ((&({b, d})) && ((b >>> f) || $unsigned(10))));
  assign y419 = ((($signed(c[s+:5]) | 4'sd11) ^ $signed((d[6:3] ^ g))) <<< s);
  assign y420 = ((z[0-:1] ^~ b[s+:1]) - (h && g[2]));
  assign y421 = e;
  assign y422 = f;
  assign y423 = f;
  assign y424 = ($unsigned((!($unsigned(e)))) ? (((b && w) ? (|(6'hf)) : (d[2:1] | a[3:1])) ^ z) : c);
  assign y425 = f[1];
  assign y426 = (&(({9'b11000111, z[0]} && (d ? s : a[2]))));
  assign y427 = (-({g}));
  assign y428 = {1{c}};
  assign y429 = $unsigned({(a[a] ^ s[0]), (8'd149 - w[10-:8])});
  assign y430 = f[1];
  assign y431 = e;
  assign y432 = 8'sb11001100;
  assign y433 = (4'b101 && f[f]);
  assign y434 = ($signed((5'o23 * g[a])) <= $signed((33 ^ d[7:1])));
  assign y435 = $unsigned((~(g[1:3])));
  assign y436 = (~(b));
  assign y437 = $signed(f);
  assign y438 = {s, d};
  assign y439 = (($signed(c) > $signed(z[0])) * ((c <= s[1]) - (a != e)));
  assign y440 = (f[e] & 10);
  assign y441 = (-($signed((~^(c)))));
  assign y442 = b;
  assign y443 = s[a];
  assign y444 = (!(8'o101));
  assign y445 = ((&(s[2:2])) <<< s);
  assign y446 = g;
  assign y447 = (&(((s[0] >= f[0+:1]) ? ('h98 != e) : {w, a[3:0], c})));
  assign y448 = ($unsigned({g, f[a]}) <<< s);
  assign y449 = z;
  assign y450 = (s[1:0] & h);
  assign y451 = (($unsigned({2{z[0:0]}}) ? (f && (g[f] - f)) : d) >= {($signed(a) || {e, d[7], c}), (!((z[0] ^ b[s]))), {(7'd31 - g)}});
  assign y452 = (&((a[e] + z[a])));
  assign y453 = (s[2] - f[s]);
  assign y454 = (d[2:1] <= 'h126);
  assign y455 = (h || h);
  assign y456 = e;
  assign y457 = s[1];
  assign y458 = $unsigned(({h, s, a} >> 1));
  assign y459 = 1'sd0;
  assign y460 = (s[1] <<< f);
  assign y461 = (((b + h) - 2'h0) ? ({h, w} < (h > b)) : ($signed(z) ? $unsigned(w) : {w[3], d[0]}));
  assign y462 = a;
  assign y463 = {2{{((s[e] <<< s) >> s), a[1:0]}}};
  assign y464 = ($signed((d | a)) > ((z >>> 2) & (z[0] ^ h)));
  assign y465 = $signed((w[a] ? (~({a[a], c})) : e));
  assign y466 = (+({(s[2] == s[1:0]), (3'sh4 & d), {s}}));
  assign y467 = f;
  assign y468 = (-(s[e]));
  assign y469 = $signed(w[s+:4]);
  assign y470 = (|((e ? g[1:2] : c)));
  assign y471 = s;
  assign y472 = 9'o752;
  assign y473 = (d && 9'sb111101110);
  assign y474 = $unsigned((w | f[1:1]));
  assign y475 = (&((e <= s[1:1])));
  assign y476 = (c ? g : z[s]);
  assign y477 = (d && f);
  assign y478 = (!({3{e}}));
  assign y479 = (($unsigned(38) - (d < z)) ^ ((w[6] >= d) - (!(d))));
  assign y480 = $signed(a);
  assign y481 = (b[f] + e);
  assign y482 = s;
  assign y483 = (((d ? s[1] : b) ~^ $signed(h[s])) ? (^({c[6]})) : z);
  assign y484 = w[f];
  assign y485 = 4;
  assign y486 = a[e];
  assign y487 = f;
  assign y488 = z;
  assign y489 = 'h11f;
  assign y490 = {(~(e)), (~|(d[4-:4])), {c, z}};
  assign y491 = b;
  assign y492 = (&((~|(((f & g) >>> 2)))));
  assign y493 = g[0:3];
  assign y494 = a;
  assign y495 = (s + 9'b101100);
  assign y496 = $unsigned(2'd0);
  assign y497 = (h ? w[e] : d[6:5]);
  assign y498 = s[0];
  assign y499 = $signed(s);
endmodule
